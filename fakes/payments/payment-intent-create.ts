import type { Metadata } from './api-objects';
import { recordEvent } from './event-log';
import { newObjectId, unixNow } from './object-id';
import type { PaymentIntent } from './payment-objects';
import type { PaymentsContext } from './payments-context';

/**
 * Creates a PaymentIntent waiting for a payment method and records payment_intent.created.
 * Call inside `store.mutate`.
 *
 * @param context - the stand-in context.
 * @param fields - amount (minor units, ≥ 1), lower-case ISO 4217 currency, optional customer id,
 *   description, metadata and receipt e-mail.
 * @returns the stored intent (status 'requires_payment_method').
 * @example createPaymentIntent(context, { amount: 1999, currency: 'eur', … }).status
 */
export function createPaymentIntent(
  context: PaymentsContext,
  fields: {
    amount: number;
    currency: string;
    customer: string | null;
    description: string | null;
    metadata: Metadata;
    receiptEmail: string | null;
  },
): PaymentIntent {
  const id = newObjectId('pi');
  const intent: PaymentIntent = {
    id,
    object: 'payment_intent',
    amount: fields.amount,
    amount_capturable: 0,
    amount_received: 0,
    canceled_at: null,
    capture_method: 'automatic_async',
    client_secret: `${id}_secret_${newObjectId('x', 24).slice(2)}`,
    confirmation_method: 'automatic',
    created: unixNow(),
    currency: fields.currency,
    customer: fields.customer,
    description: fields.description,
    last_payment_error: null,
    latest_charge: null,
    livemode: false,
    metadata: fields.metadata,
    next_action: null,
    payment_method: null,
    payment_method_types: ['card'],
    receipt_email: fields.receiptEmail,
    status: 'requires_payment_method',
  };
  context.store.state.paymentIntents[id] = intent;
  recordEvent(context, 'payment_intent.created', intent);
  return intent;
}
