import type { JsonObject, StripeEvent } from './api-objects';
import { PAYMENTS_API_VERSION } from './api-version';
import { newObjectId, unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';

/** Event types the stand-in emits (a subset of the API's, same names and payloads). */
export type EventType =
  | 'customer.created'
  | 'customer.updated'
  | 'customer.deleted'
  | 'checkout.session.completed'
  | 'checkout.session.expired'
  | 'payment_intent.created'
  | 'payment_intent.succeeded'
  | 'payment_intent.payment_failed'
  | 'charge.succeeded'
  | 'charge.failed'
  | 'charge.refunded'
  | 'refund.created';

/**
 * Records an event for a state change and queues its delivery to every webhook endpoint.
 * Call it inside `store.mutate(...)` so the event and the change are persisted together.
 *
 * Payload as the API sends it: `data.object` is a snapshot of the object after the change and
 * `data.previous_attributes` holds the old values of changed fields on `*.updated`-style events;
 * `pending_webhooks` counts endpoints not yet answered with 2xx.
 *
 * @param context - the stand-in context.
 * @param type - event type, e.g. 'checkout.session.completed'.
 * @param object - the object the event is about (copied, later changes do not leak in).
 * @param previousAttributes - old values of the changed fields, when meaningful.
 * @returns the stored event.
 * @example recordEvent(context, 'refund.created', refund).id.startsWith('evt_') === true
 */
export function recordEvent(
  context: PaymentsContext,
  type: EventType,
  object: JsonObject,
  previousAttributes?: JsonObject,
): StripeEvent {
  const { state } = context.store;
  const event: StripeEvent = {
    id: newObjectId('evt'),
    object: 'event',
    api_version: PAYMENTS_API_VERSION,
    created: unixNow(),
    data: previousAttributes
      ? {
          object: structuredClone(object),
          previous_attributes: structuredClone(previousAttributes),
        }
      : { object: structuredClone(object) },
    livemode: false,
    pending_webhooks: context.webhookUrls.length,
    request: { id: null, idempotency_key: null },
    type,
  };
  state.events[event.id] = event;
  for (const url of context.webhookUrls) {
    const id = newObjectId('whdel');
    state.deliveries[id] = {
      id,
      eventId: event.id,
      url,
      nextAttemptAt: Date.now(),
      deliveredAt: null,
      attempts: [],
    };
  }
  if (context.webhookUrls.length) context.wakeDelivery();
  return event;
}

/**
 * Old values of the fields that differ between two versions of an object (shallow, as the
 * API's `previous_attributes`).
 * @example changedAttributes({ a: 1, b: 2 }, { a: 1, b: 3 }) // { b: 2 }
 */
export function changedAttributes(before: JsonObject, after: JsonObject): JsonObject {
  const changed: JsonObject = {};
  for (const key of Object.keys(after)) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key]))
      changed[key] = before[key] ?? null;
  }
  return changed;
}
