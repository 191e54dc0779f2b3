/**
 * Shapes of the payment API objects the stand-in serves: the fields the SDK and Sidecheck read,
 * named and typed as in the public API reference (from memory). Declared as type aliases, not
 * interfaces, so they are assignable to {@link JsonObject} for expansion and persistence.
 * Amounts are integers in the currency's minor unit; `created` is Unix time in seconds.
 */

export type Json = string | number | boolean | null | Json[] | { [key: string]: Json };
export type JsonObject = { [key: string]: Json };
export type Metadata = { [key: string]: string };

export type Address = {
  city: string | null;
  country: string | null;
  line1: string | null;
  line2: string | null;
  postal_code: string | null;
  state: string | null;
};

export type Customer = {
  id: string;
  object: 'customer';
  address: Address | null;
  balance: number;
  created: number;
  currency: string | null;
  default_source: null;
  delinquent: boolean;
  description: string | null;
  email: string | null;
  invoice_prefix: string;
  livemode: false;
  metadata: Metadata;
  name: string | null;
  phone: string | null;
  preferred_locales: string[];
  shipping: null;
  tax_exempt: 'none';
  test_clock: null;
};

export type Product = {
  id: string;
  object: 'product';
  active: boolean;
  created: number;
  description: string | null;
  images: string[];
  livemode: false;
  metadata: Metadata;
  name: string;
  updated: number;
};

export type Price = {
  id: string;
  object: 'price';
  active: boolean;
  billing_scheme: 'per_unit';
  created: number;
  currency: string;
  livemode: false;
  metadata: Metadata;
  product: string;
  recurring: null;
  tax_behavior: 'unspecified';
  type: 'one_time';
  unit_amount: number;
  unit_amount_decimal: string;
};

export type LineItem = {
  id: string;
  object: 'item';
  amount_discount: number;
  amount_subtotal: number;
  amount_tax: number;
  amount_total: number;
  currency: string;
  description: string;
  price: Price;
  quantity: number;
};

export type CustomerDetails = {
  address: Address | null;
  email: string | null;
  name: string | null;
  phone: string | null;
  tax_exempt: 'none';
  tax_ids: Json[];
};

export type CheckoutSession = {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer: string | null;
  customer_creation: 'if_required' | null;
  customer_details: CustomerDetails | null;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  locale: string | null;
  metadata: Metadata;
  mode: 'payment';
  payment_intent: string | null;
  payment_method_types: string[];
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string | null;
  total_details: { amount_discount: number; amount_shipping: number; amount_tax: number };
  ui_mode: 'hosted';
  url: string | null;
};

export type CardDetails = {
  brand: string;
  country: string;
  exp_month: number;
  exp_year: number;
  funding: 'credit';
  last4: string;
};

export type PaymentError = {
  type: 'card_error';
  code: string;
  decline_code?: string;
  message: string;
  charge?: string;
  doc_url?: string;
};

export type PaymentIntent = {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_capturable: number;
  amount_received: number;
  canceled_at: number | null;
  capture_method: 'automatic_async';
  client_secret: string;
  confirmation_method: 'automatic';
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  last_payment_error: PaymentError | null;
  latest_charge: string | null;
  livemode: false;
  metadata: Metadata;
  next_action: null;
  payment_method: string | null;
  payment_method_types: string[];
  receipt_email: string | null;
  status: 'requires_payment_method' | 'requires_confirmation' | 'succeeded';
};

export type Charge = {
  id: string;
  object: 'charge';
  amount: number;
  amount_captured: number;
  amount_refunded: number;
  billing_details: { address: Address | null; email: string | null; name: string | null; phone: null };
  captured: boolean;
  created: number;
  currency: string;
  customer: string | null;
  description: string | null;
  failure_code: string | null;
  failure_message: string | null;
  livemode: false;
  metadata: Metadata;
  outcome: { network_status: string; reason: string | null; seller_message: string; type: string };
  paid: boolean;
  payment_intent: string;
  payment_method: string;
  payment_method_details: { card: CardDetails; type: 'card' };
  refunded: boolean;
  status: 'succeeded' | 'failed';
};

export type Refund = {
  id: string;
  object: 'refund';
  amount: number;
  charge: string;
  created: number;
  currency: string;
  metadata: Metadata;
  payment_intent: string;
  reason: 'duplicate' | 'fraudulent' | 'requested_by_customer' | null;
  receipt_number: null;
  status: 'succeeded';
};

export type StripeEvent = {
  id: string;
  object: 'event';
  api_version: string;
  created: number;
  data: { object: JsonObject; previous_attributes?: JsonObject };
  livemode: false;
  pending_webhooks: number;
  request: { id: string | null; idempotency_key: string | null };
  type: string;
};

/** List envelope of every list endpoint (`has_more` drives the SDK's auto-pagination). */
export type ListObject = { object: 'list'; data: JsonObject[]; has_more: boolean; url: string };
