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
