import type { Request } from 'express';
import type { JsonObject } from './api-objects';
import { expandObject } from './expand-fields';
import { expandParam, type FormBody } from './form-params';
import type { PaymentsContext } from './payments-context';

/**
 * The JSON to answer with for one object: a copy with the request's `expand[]` applied (from the
 * query on GET, the body on POST, as the SDK sends it).
 *
 * @param context - the stand-in context.
 * @param request - the current request.
 * @param object - the stored object.
 * @returns a deep copy, expanded.
 * @throws ApiError 400 for an expansion that is not possible.
 * @example response.json(presentObject(context, request, customer))
 */
export function presentObject(
  context: PaymentsContext,
  request: Request,
  object: JsonObject,
): JsonObject {
  return expandObject(context.store.state, object, requestExpand(request));
}

/** The expansion paths of a request; list endpoints apply them to the list (`data.x`). */
export function requestExpand(request: Request): string[] {
  return expandParam(requestParams(request));
}

/** The decoded parameters of a request: the query for GET/DELETE, the body for POST. */
export function requestParams(request: Request): FormBody {
  const source: unknown = request.method === 'POST' ? request.body : request.query;
  return typeof source === 'object' && source !== null ? (source as FormBody) : {};
}
