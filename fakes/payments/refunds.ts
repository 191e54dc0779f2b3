import { Router } from 'express';
import { invalidParam, missingParam, noSuch } from './api-error';
import type { Charge, Refund } from './payment-objects';
import { changedAttributes, recordEvent } from './event-log';
import { expandObject } from './expand-fields';
import { optionalEnum, optionalInteger, optionalString, rejectUnknownParams } from './form-params';
import { createdFilter, listPage } from './list-page';
import { readMetadata } from './metadata-param';
import { newObjectId, unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';
import { presentObject, requestExpand, requestParams } from './present-object';

/**
 * Refunds: `POST /v1/refunds` (payment_intent or charge; amount optional = what is left),
 * `GET /v1/refunds/:id`, `GET /v1/refunds` (filters payment_intent, charge, created). Each refund
 * succeeds at once (card refunds in test mode do, from memory), raises the charge's
 * `amount_refunded` (`refunded` once it reaches the amount) and records refund.created and
 * charge.refunded.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 */
export function refundsRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.post('/refunds', (request, response) => {
    const body = requestParams(request);
    rejectUnknownParams(body, ['payment_intent', 'charge', 'amount', 'reason', 'metadata']);
    const charge = refundableCharge(
      context,
      optionalString(body, 'payment_intent'),
      optionalString(body, 'charge'),
    );
    const left = charge.amount - charge.amount_refunded;
    if (left <= 0)
      throw invalidParam(
        'charge',
        `Charge ${charge.id} has already been refunded.`,
        'charge_already_refunded',
      );
    const amount = optionalInteger(body, 'amount', { min: 1 }) ?? left;
    if (amount > left) {
      throw invalidParam(
        'amount',
        `Refund amount (${amount}) is greater than unrefunded amount on charge (${left}).`,
      );
    }
    const reason =
      optionalEnum(body, 'reason', ['duplicate', 'fraudulent', 'requested_by_customer'] as const) ??
      null;
    const metadata = readMetadata(body) ?? {};

    const refund = store.mutate(() => {
      const created: Refund = {
        id: newObjectId('re'),
        object: 'refund',
        amount,
        charge: charge.id,
        created: unixNow(),
        currency: charge.currency,
        metadata,
        payment_intent: charge.payment_intent,
        reason,
        receipt_number: null,
        status: 'succeeded',
      };
      store.state.refunds[created.id] = created;
      const before = structuredClone(charge);
      charge.amount_refunded += amount;
      charge.refunded = charge.amount_refunded === charge.amount;
      recordEvent(context, 'refund.created', created);
      recordEvent(context, 'charge.refunded', charge, changedAttributes(before, charge));
      return created;
    });
    response.json(presentObject(context, request, refund));
  });

  router.get('/refunds/:id', (request, response) => {
    const id = String(request.params['id']);
    const refund = store.state.refunds[id];
    if (!refund) throw noSuch('refund', id);
    response.json(presentObject(context, request, refund));
  });

  router.get('/refunds', (request, response) => {
    const query = requestParams(request);
    const paymentIntent = optionalString(query, 'payment_intent');
    const charge = optionalString(query, 'charge');
    const inRange = createdFilter(query);
    const matches = Object.values(store.state.refunds)
      .reverse()
      .filter(
        (refund) =>
          (paymentIntent === undefined || refund.payment_intent === paymentIntent) &&
          (charge === undefined || refund.charge === charge) &&
          inRange(refund.created),
      );
    const page = listPage(matches, query, '/v1/refunds', (refund) => refund);
    response.json(expandObject(store.state, page, requestExpand(request)));
  });

  return router;
}

/** The succeeded charge a refund request points at, by intent or charge id. */
function refundableCharge(context: PaymentsContext, intentId?: string, chargeId?: string): Charge {
  const { state } = context.store;
  if (!intentId && !chargeId) throw missingParam('payment_intent');
  let charge: Charge | undefined;
  if (intentId) {
    const intent = state.paymentIntents[intentId];
    if (!intent) throw noSuch('payment_intent', intentId, { param: 'payment_intent' });
    charge =
      intent.status === 'succeeded' && intent.latest_charge
        ? state.charges[intent.latest_charge]
        : undefined;
    if (!charge) {
      throw invalidParam(
        'payment_intent',
        `This PaymentIntent (${intentId}) does not have a successful charge to refund.`,
      );
    }
    if (chargeId && chargeId !== charge.id) {
      throw invalidParam(
        'charge',
        `Charge ${chargeId} does not belong to PaymentIntent ${intentId}.`,
      );
    }
    return charge;
  }
  charge = state.charges[chargeId ?? ''];
  if (!charge) throw noSuch('charge', chargeId ?? '', { param: 'charge' });
  if (charge.status !== 'succeeded')
    throw invalidParam('charge', `Charge ${charge.id} did not succeed and cannot be refunded.`);
  return charge;
}
