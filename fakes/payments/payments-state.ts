import type { Customer, JsonObject, Metadata, StripeEvent } from './api-objects';
import type { CheckoutSession, LineItem, Product } from './checkout-objects';
import type { Charge, PaymentIntent, Refund } from './payment-objects';

/** One attempt to deliver an event to one webhook endpoint. */
export type DeliveryAttempt = {
  /** ISO time the request started. */
  at: string;
  /** HTTP status received, null when the request failed before a response. */
  status: number | null;
  error: string | null;
  durationMs: number;
};

/** The delivery of one event to one endpoint: retried until a 2xx answer. */
export type WebhookDelivery = {
  id: string;
  eventId: string;
  url: string;
  /** Epoch ms of the next scheduled attempt, null once delivered. */
  nextAttemptAt: number | null;
  /** ISO time of the first 2xx answer, null while pending. */
  deliveredAt: string | null;
  attempts: DeliveryAttempt[];
};

/** A completed POST remembered under its Idempotency-Key. */
export type IdempotentResponse = {
  fingerprint: string;
  status: number;
  body: JsonObject;
  /** Epoch ms; records older than 24 h are dropped, as the API documents (from memory). */
  createdAt: number;
};

/**
 * Everything the payments stand-in knows, persisted as one JSON document. Collections are keyed
 * by id; JSON keeps string-key insertion order, so iteration order is creation order.
 */
export type PaymentsState = {
  version: 1;
  customers: Record<string, Customer>;
  products: Record<string, Product>;
  checkoutSessions: Record<string, CheckoutSession>;
  /** Line items by Checkout Session id (served only on expansion or the line_items endpoint). */
  lineItems: Record<string, LineItem[]>;
  /** `payment_intent_data` of each session, applied to the PaymentIntent made when paying. */
  paymentIntentData: Record<string, { description: string | null; metadata: Metadata }>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  events: Record<string, StripeEvent>;
  deliveries: Record<string, WebhookDelivery>;
  idempotency: Record<string, IdempotentResponse>;
};

/**
 * A fresh, empty state.
 * @example emptyPaymentsState().customers // {}
 */
export function emptyPaymentsState(): PaymentsState {
  return {
    version: 1,
    customers: {},
    products: {},
    checkoutSessions: {},
    lineItems: {},
    paymentIntentData: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    events: {},
    deliveries: {},
    idempotency: {},
  };
}
