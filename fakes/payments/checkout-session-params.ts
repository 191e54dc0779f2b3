import { invalidParam, missingParam, noSuch } from './api-error';
import type { Metadata } from './api-objects';
import {
  isPlausibleEmail,
  optionalArray,
  optionalEnum,
  optionalInteger,
  optionalObject,
  optionalString,
  rejectUnknownParams,
  type FormBody,
} from './form-params';
import { readLineItem, type LineItemDraft } from './line-item-params';
import { readMetadata } from './metadata-param';
import { unixNow } from './object-id';
import type { PaymentsState } from './payments-state';
import { readUrl } from './url-param';

/** The validated parameters of `POST /v1/checkout/sessions`. */
export type CheckoutSessionDraft = {
  currency: string;
  items: LineItemDraft[];
  customer: string | null;
  customerEmail: string | null;
  successUrl: string | null;
  cancelUrl: string | null;
  metadata: Metadata;
  clientReferenceId: string | null;
  expiresAt: number;
  locale: string | null;
  paymentIntentData: { description: string | null; metadata: Metadata };
};

const TOP_LEVEL = [
  'mode',
  'line_items',
  'customer',
  'customer_email',
  'success_url',
  'cancel_url',
  'metadata',
  'client_reference_id',
  'expires_at',
  'payment_method_types',
  'locale',
  'payment_intent_data',
  'ui_mode',
];

/**
 * Validates the parameters of a new Checkout Session against the API's rules for the subset we
 * serve (from memory): mode 'payment' only; 1–100 line items with `price_data` {currency,
 * unit_amount, product_data{name}} and `quantity` ≥ 1, all in one currency; at most one of
 * `customer` and `customer_email`; `expires_at` 30 min – 24 h ahead (default 24 h).
 *
 * @param state - to check that a given customer exists.
 * @param body - the decoded form body.
 * @returns the draft.
 * @throws ApiError 400 naming the offending parameter.
 * @example readCheckoutSessionParams(state, body).items[0].unitAmount // 1999
 */
export function readCheckoutSessionParams(
  state: PaymentsState,
  body: FormBody,
): CheckoutSessionDraft {
  rejectUnknownParams(body, TOP_LEVEL);
  const mode = optionalString(body, 'mode');
  if (!mode) throw missingParam('mode');
  if (mode !== 'payment')
    throw invalidParam('mode', `This stand-in supports mode 'payment' only, not '${mode}'.`);
  optionalEnum(body, 'ui_mode', ['hosted'] as const);
  const methods = optionalArray(body, 'payment_method_types');
  if (methods && methods.some((method) => method !== 'card')) {
    throw invalidParam(
      'payment_method_types',
      'Only the payment method type card is available here.',
    );
  }
  const rawItems = optionalArray(body, 'line_items');
  if (!rawItems?.length) throw missingParam('line_items');
  if (rawItems.length > 100)
    throw invalidParam('line_items', 'You can have at most 100 line items.');
  const parsed = rawItems.map((raw, index) => readLineItem(raw, `line_items[${index}]`));
  const currency = parsed[0].currency;
  const other = parsed.findIndex((item) => item.currency !== currency);
  if (other >= 0) {
    throw invalidParam(
      `line_items[${other}][price_data][currency]`,
      'All line items must use the same currency.',
    );
  }
  const total = parsed.reduce((sum, item) => sum + item.unitAmount * item.quantity, 0);
  if (total < 1)
    throw invalidParam('line_items', 'The total of a payment-mode session must be at least 1.');

  const customer = optionalString(body, 'customer') || null;
  const customerEmail = optionalString(body, 'customer_email') || null;
  if (customer && customerEmail) {
    throw invalidParam(
      'customer_email',
      'You may only specify one of these parameters: customer, customer_email.',
    );
  }
  if (customer && !state.customers[customer])
    throw noSuch('customer', customer, { param: 'customer' });
  if (customerEmail && !isPlausibleEmail(customerEmail)) {
    throw invalidParam(
      'customer_email',
      `Invalid email address: ${customerEmail}`,
      'email_invalid',
    );
  }
  const clientReferenceId = optionalString(body, 'client_reference_id') || null;
  if (clientReferenceId && clientReferenceId.length > 200) {
    throw invalidParam('client_reference_id', 'client_reference_id can be at most 200 characters.');
  }
  const now = unixNow();
  const expiresAt = optionalInteger(body, 'expires_at') ?? now + 24 * 3600;
  if (expiresAt < now + 30 * 60 || expiresAt > now + 24 * 3600) {
    throw invalidParam(
      'expires_at',
      'expires_at must be between 30 minutes and 24 hours from now.',
    );
  }
  const intentData = optionalObject(body, 'payment_intent_data') ?? {};
  rejectUnknownParams(intentData, ['description', 'metadata'], 'payment_intent_data');

  return {
    currency,
    items: parsed.map(({ currency: _currency, ...item }) => item),
    customer,
    customerEmail,
    successUrl: readUrl(body, 'success_url'),
    cancelUrl: readUrl(body, 'cancel_url'),
    metadata: readMetadata(body) ?? {},
    clientReferenceId,
    expiresAt,
    locale: optionalString(body, 'locale') || null,
    paymentIntentData: {
      description:
        optionalString(intentData, 'description', 'payment_intent_data[description]') || null,
      metadata: readMetadata(intentData, 'payment_intent_data[metadata]') ?? {},
    },
  };
}
