import type { JsonObject, ListObject } from './api-objects';
import { invalidParam } from './api-error';
import type { PaymentsState } from './payments-state';

/** The API allows expansions up to four levels deep (from memory). */
const MAX_EXPAND_DEPTH = 4;

/**
 * Returns a copy of an API object with the `expand[]` paths replaced by the objects they name,
 * as the API's expansion does: 'payment_intent' turns the id into the PaymentIntent,
 * 'payment_intent.latest_charge' goes one level further, 'data.customer' applies to each item of
 * a list, and a Checkout Session's 'line_items' (never sent unexpanded) becomes a list.
 * A null field stays null. The stored object is never modified.
 *
 * @param state - where referenced objects are looked up (by id prefix).
 * @param object - the object to present.
 * @param paths - dotted expansion paths from the request.
 * @returns the expanded deep copy.
 * @throws ApiError 400 for a path that is too deep or names a field that cannot be expanded.
 * @example expandObject(state, session, ['payment_intent']).payment_intent.object === 'payment_intent'
 */
export function expandObject(
  state: PaymentsState,
  object: JsonObject,
  paths: readonly string[],
): JsonObject {
  const copy = structuredClone(object);
  for (const path of paths) {
    const segments = path.split('.');
    if (segments.length > MAX_EXPAND_DEPTH) {
      throw invalidParam(
        'expand',
        `You cannot expand more than ${MAX_EXPAND_DEPTH} levels of a property.`,
      );
    }
    expandPath(state, copy, segments, path);
  }
  return copy;
}

/** The line items of a session as the list object the API returns for them. */
export function lineItemsList(state: PaymentsState, sessionId: string): ListObject {
  return {
    object: 'list',
    data: structuredClone(state.lineItems[sessionId] ?? []),
    has_more: false,
    url: `/v1/checkout/sessions/${sessionId}/line_items`,
  };
}

function expandPath(
  state: PaymentsState,
  node: JsonObject,
  segments: string[],
  path: string,
): void {
  const [field, ...rest] = segments;
  if (node['object'] === 'list' && field === 'data' && Array.isArray(node['data'])) {
    for (const item of node['data']) {
      if (isObject(item) && rest.length) expandPath(state, item, rest, path);
    }
    return;
  }
  if (
    field === 'line_items' &&
    node['object'] === 'checkout.session' &&
    typeof node['id'] === 'string'
  ) {
    node[field] = lineItemsList(state, node['id']);
  } else if (typeof node[field] === 'string') {
    const found = lookUp(state, node[field]);
    if (!found) throw invalidParam('expand', `This property cannot be expanded (${path}).`);
    node[field] = structuredClone(found);
  } else if (node[field] === null) {
    return;
  } else if (!isObject(node[field])) {
    throw invalidParam('expand', `This property cannot be expanded (${path}).`);
  }
  const child = node[field];
  if (rest.length && isObject(child)) expandPath(state, child, rest, path);
}

function lookUp(state: PaymentsState, id: string): JsonObject | undefined {
  const prefix = id.slice(0, id.indexOf('_'));
  const collections: Record<string, Record<string, JsonObject>> = {
    cus: state.customers,
    prod: state.products,
    cs: state.checkoutSessions,
    pi: state.paymentIntents,
    ch: state.charges,
    re: state.refunds,
  };
  return collections[prefix]?.[id];
}

function isObject(value: unknown): value is JsonObject {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
