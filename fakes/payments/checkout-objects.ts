import type { Address, Json, Metadata } from './api-objects';

/**
 * Checkout objects as the API returns them (from memory): ad-hoc products and prices made from
 * `price_data`, line items, and the session itself. Type aliases, so they fit JsonObject.
 */

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
