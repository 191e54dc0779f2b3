import type { CheckoutSession, LineItem, Price, Product } from './checkout-objects';
import type { CheckoutSessionDraft } from './checkout-session-params';
import { newObjectId, unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';

/**
 * Stores a new open Checkout Session from validated parameters, with the ad-hoc products,
 * prices and line items its `price_data` describes; totals are Σ unit_amount × quantity (no tax,
 * discounts or shipping here). Call inside `store.mutate`.
 *
 * @param context - the stand-in context (its baseUrl makes the hosted-page `url`).
 * @param draft - the validated parameters.
 * @returns the stored session, status 'open', payment_status 'unpaid'.
 * @example createCheckoutSession(context, draft).url // 'http://127.0.0.1:12111/pay/cs_test_…'
 */
export function createCheckoutSession(
  context: PaymentsContext,
  draft: CheckoutSessionDraft,
): CheckoutSession {
  const { state } = context.store;
  const created = unixNow();
  const id = newObjectId('cs_test', 58);
  const items = draft.items.map((item): LineItem => {
    const product: Product = {
      id: newObjectId('prod', 14),
      object: 'product',
      active: false,
      created,
      description: item.description,
      images: [],
      livemode: false,
      metadata: item.productMetadata,
      name: item.name,
      updated: created,
    };
    state.products[product.id] = product;
    const price: Price = {
      id: newObjectId('price'),
      object: 'price',
      active: false,
      billing_scheme: 'per_unit',
      created,
      currency: draft.currency,
      livemode: false,
      metadata: {},
      product: product.id,
      recurring: null,
      tax_behavior: 'unspecified',
      type: 'one_time',
      unit_amount: item.unitAmount,
      unit_amount_decimal: String(item.unitAmount),
    };
    const amount = item.unitAmount * item.quantity;
    return {
      id: newObjectId('li'),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: amount,
      amount_tax: 0,
      amount_total: amount,
      currency: draft.currency,
      description: item.name,
      price,
      quantity: item.quantity,
    };
  });
  const total = items.reduce((sum, item) => sum + item.amount_total, 0);
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    amount_subtotal: total,
    amount_total: total,
    cancel_url: draft.cancelUrl,
    client_reference_id: draft.clientReferenceId,
    created,
    currency: draft.currency,
    customer: draft.customer,
    customer_creation: draft.customer ? null : 'if_required',
    customer_details: null,
    customer_email: draft.customerEmail,
    expires_at: draft.expiresAt,
    livemode: false,
    locale: draft.locale,
    metadata: draft.metadata,
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    success_url: draft.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${context.baseUrl}/pay/${id}`,
  };
  state.checkoutSessions[id] = session;
  state.lineItems[id] = items;
  // Real Checkout sends no event on creation either, and creates the PaymentIntent only when the
  // buyer pays (API versions since 2022-08-01, from memory): payment_intent stays null until then.
  state.paymentIntentData[id] = draft.paymentIntentData;
  return session;
}
