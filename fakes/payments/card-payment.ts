import type { Charge, PaymentError, PaymentIntent } from './payment-objects';
import { recordEvent } from './event-log';
import { newObjectId, unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';
import { cardBrand, cardOutcome } from './test-cards';

/** A card as entered on the hosted page or named by a test PaymentMethod. */
export type CardInput = {
  /** Digits only. */
  number: string;
  expMonth: number;
  /** Four digits. */
  expYear: number;
  name: string | null;
  email: string | null;
};

/**
 * Charges a card for a PaymentIntent, as automatic capture does: one Charge per attempt; on
 * approval the intent becomes 'succeeded' (charge.succeeded, payment_intent.succeeded), on a
 * decline it goes back to 'requires_payment_method' with `last_payment_error` set so the buyer
 * can retry (charge.failed, payment_intent.payment_failed). Call inside `store.mutate`.
 *
 * @param context - the stand-in context.
 * @param intent - the stored intent, not yet succeeded.
 * @param card - the card to charge.
 * @returns the new charge and, for a decline, the card error to report.
 * @throws TypeError when the intent has already succeeded.
 * @example chargeCard(context, intent, card).error?.decline_code === 'generic_decline'
 */
export function chargeCard(
  context: PaymentsContext,
  intent: PaymentIntent,
  card: CardInput,
): { charge: Charge; error: PaymentError | null } {
  if (intent.status === 'succeeded')
    throw new TypeError(`chargeCard: ${intent.id} has already succeeded`);
  const outcome = cardOutcome(card.number);
  const approved = outcome.kind === 'approved';
  const paymentMethod = newObjectId('pm');
  const charge: Charge = {
    id: newObjectId('ch'),
    object: 'charge',
    amount: intent.amount,
    amount_captured: approved ? intent.amount : 0,
    amount_refunded: 0,
    billing_details: { address: null, email: card.email, name: card.name, phone: null },
    captured: approved,
    created: unixNow(),
    currency: intent.currency,
    customer: intent.customer,
    description: intent.description,
    failure_code: approved ? null : outcome.code,
    failure_message: approved ? null : outcome.message,
    livemode: false,
    metadata: intent.metadata,
    outcome: approved
      ? {
          network_status: 'approved_by_network',
          reason: null,
          seller_message: 'Payment complete.',
          type: 'authorized',
        }
      : {
          network_status: 'declined_by_network',
          reason: outcome.declineCode ?? outcome.code,
          seller_message: 'The bank declined the payment.',
          type: 'issuer_declined',
        },
    paid: approved,
    payment_intent: intent.id,
    payment_method: paymentMethod,
    payment_method_details: {
      type: 'card',
      card: {
        brand: cardBrand(card.number),
        country: 'US',
        exp_month: card.expMonth,
        exp_year: card.expYear,
        funding: 'credit',
        last4: card.number.slice(-4),
      },
    },
    refunded: false,
    status: approved ? 'succeeded' : 'failed',
  };
  context.store.state.charges[charge.id] = charge;
  intent.latest_charge = charge.id;
  intent.payment_method = paymentMethod;
  if (approved) {
    intent.status = 'succeeded';
    intent.amount_received = intent.amount;
    intent.last_payment_error = null;
    recordEvent(context, 'charge.succeeded', charge);
    recordEvent(context, 'payment_intent.succeeded', intent);
    return { charge, error: null };
  }
  const error: PaymentError = {
    type: 'card_error',
    code: outcome.code,
    message: outcome.message,
    charge: charge.id,
  };
  if (outcome.declineCode) error.decline_code = outcome.declineCode;
  intent.status = 'requires_payment_method';
  intent.last_payment_error = error;
  recordEvent(context, 'charge.failed', charge);
  recordEvent(context, 'payment_intent.payment_failed', intent);
  return { charge, error };
}
