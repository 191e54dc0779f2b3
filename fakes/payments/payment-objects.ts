import type { Address, Metadata } from './api-objects';

/**
 * Payment objects as the API returns them (from memory): PaymentIntent, its Charges, Refunds and
 * the card error kept as `last_payment_error`. Type aliases, so they fit JsonObject.
 */

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
  billing_details: {
    address: Address | null;
    email: string | null;
    name: string | null;
    phone: null;
  };
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
