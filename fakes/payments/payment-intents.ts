import { Router } from 'express';
import { ApiError, invalidParam, missingParam, noSuch } from './api-error';
import type { JsonObject } from './api-objects';
import type { PaymentIntent } from './payment-objects';
import { chargeCard } from './card-payment';
import { createPaymentIntent } from './payment-intent-create';
import { expandObject } from './expand-fields';
import {
  isPlausibleEmail,
  optionalBoolean,
  optionalInteger,
  optionalObject,
  optionalString,
  rejectUnknownParams,
} from './form-params';
import { createdFilter, listPage } from './list-page';
import { readMetadata } from './metadata-param';
import type { PaymentsContext } from './payments-context';
import { presentObject, requestExpand, requestParams } from './present-object';
import { TEST_PAYMENT_METHODS } from './test-cards';

const CREATE_PARAMS = [
  'amount',
  'currency',
  'customer',
  'description',
  'metadata',
  'payment_method',
  'confirm',
  'payment_method_types',
  'receipt_email',
  'automatic_payment_methods',
  'off_session',
];

/**
 * PaymentIntents: `GET /v1/payment_intents/:id`, `GET /v1/payment_intents` (filters customer,
 * created), and `POST /v1/payment_intents` with `confirm=true` and a test PaymentMethod
 * (pm_card_visa, pm_card_chargeDeclined …) for server-side charges. A declined confirmation
 * answers 402 card_error carrying `payment_intent`, as the API does — the SDK raises it as
 * StripeCardError.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 */
export function paymentIntentsRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.post('/payment_intents', (request, response) => {
    const body = requestParams(request);
    rejectUnknownParams(body, CREATE_PARAMS);
    const amount = optionalInteger(body, 'amount', { min: 1, max: 99_999_999 });
    if (amount === undefined) throw missingParam('amount');
    const currency = optionalString(body, 'currency')?.toLowerCase();
    if (!currency || !/^[a-z]{3}$/.test(currency)) throw missingParam('currency');
    const customer = optionalString(body, 'customer') || null;
    if (customer && !store.state.customers[customer])
      throw noSuch('customer', customer, { param: 'customer' });
    const receiptEmail = optionalString(body, 'receipt_email') || null;
    if (receiptEmail && !isPlausibleEmail(receiptEmail))
      throw invalidParam('receipt_email', `Invalid email address: ${receiptEmail}`);
    const paymentMethod = optionalString(body, 'payment_method');
    const cardNumber =
      paymentMethod === undefined ? undefined : TEST_PAYMENT_METHODS[paymentMethod];
    if (paymentMethod !== undefined && !cardNumber)
      throw noSuch('PaymentMethod', paymentMethod, { param: 'payment_method' });
    const confirm = optionalBoolean(body, 'confirm') ?? false;
    if (confirm && !cardNumber) throw missingParam('payment_method');
    optionalObject(body, 'automatic_payment_methods'); // accepted; only cards exist here
    optionalBoolean(body, 'off_session');
    const metadata = readMetadata(body) ?? {};
    const description = optionalString(body, 'description') || null;

    const { intent, error } = store.mutate(() => {
      const created = createPaymentIntent(context, {
        amount,
        currency,
        customer,
        description,
        metadata,
        receiptEmail,
      });
      if (!cardNumber) return { intent: created, error: null };
      if (!confirm) {
        created.payment_method = paymentMethod ?? null;
        created.status = 'requires_confirmation';
        return { intent: created, error: null };
      }
      const expYear = new Date().getUTCFullYear() + 1;
      const result = chargeCard(context, created, {
        number: cardNumber,
        expMonth: 12,
        expYear,
        name: null,
        email: receiptEmail,
      });
      return { intent: created, error: result.error };
    });
    if (error) {
      const { type: _type, message, code, decline_code: declineCode, ...rest } = error;
      throw new ApiError(402, 'card_error', message, {
        code,
        decline_code: declineCode,
        extra: { ...(rest as JsonObject), payment_intent: structuredClone(intent) },
      });
    }
    response.json(presentObject(context, request, intent));
  });

  router.get('/payment_intents/:id', (request, response) => {
    response.json(
      presentObject(context, request, findIntent(context, String(request.params['id']))),
    );
  });

  router.get('/payment_intents', (request, response) => {
    const query = requestParams(request);
    const customer = optionalString(query, 'customer');
    const inRange = createdFilter(query);
    const matches = Object.values(store.state.paymentIntents)
      .reverse()
      .filter(
        (intent) =>
          (customer === undefined || intent.customer === customer) && inRange(intent.created),
      );
    const page = listPage(matches, query, '/v1/payment_intents', (intent) => intent);
    response.json(expandObject(store.state, page, requestExpand(request)));
  });

  return router;
}

function findIntent(context: PaymentsContext, id: string): PaymentIntent {
  const intent = context.store.state.paymentIntents[id];
  if (!intent) throw noSuch('payment_intent', id);
  return intent;
}
