import type { JsonObject, ListObject } from './api-objects';
import { invalidParam } from './api-error';
import { optionalInteger, optionalString, type FormBody } from './form-params';

/**
 * Cuts one page out of a newest-first collection the way the API's cursor pagination does
 * (from memory): `limit` 1–100 (default 10), `starting_after` = the page after that object,
 * `ending_before` = the page just before it; `has_more` tells whether more lie beyond the page in
 * the walking direction. The SDK's auto-pagination relies on exactly this.
 *
 * @param items - the whole filtered collection, newest first.
 * @param query - the request's query (limit, starting_after, ending_before).
 * @param url - the list's path, e.g. '/v1/customers', echoed in `url`.
 * @param present - turns one stored object into its JSON (clone + expansion).
 * @returns the list object.
 * @throws ApiError 400 for a bad limit or a cursor that is not in the collection.
 * @example listPage(customers, { limit: '2' }, '/v1/customers', clone).has_more
 */
export function listPage<T extends { id: string }>(
  items: readonly T[],
  query: FormBody,
  url: string,
  present: (item: T) => JsonObject,
): ListObject {
  const limit = optionalInteger(query, 'limit', { min: 1, max: 100 }) ?? 10;
  const startingAfter = optionalString(query, 'starting_after');
  const endingBefore = optionalString(query, 'ending_before');
  let page: readonly T[];
  let hasMore: boolean;
  if (startingAfter) {
    const start = indexOf(items, startingAfter, 'starting_after') + 1;
    page = items.slice(start, start + limit);
    hasMore = start + limit < items.length;
  } else if (endingBefore) {
    const end = indexOf(items, endingBefore, 'ending_before');
    const start = Math.max(0, end - limit);
    page = items.slice(start, end);
    hasMore = start > 0;
  } else {
    page = items.slice(0, limit);
    hasMore = limit < items.length;
  }
  return { object: 'list', data: page.map(present), has_more: hasMore, url };
}

function indexOf<T extends { id: string }>(items: readonly T[], id: string, param: string): number {
  const index = items.findIndex((item) => item.id === id);
  if (index < 0) throw invalidParam(param, `No such object: '${id}'`, 'resource_missing');
  return index;
}

/**
 * Filters by the API's `created` range parameter: `created=<unix>` or `created[gt|gte|lt|lte]`.
 * @returns a predicate on Unix seconds; always-true when absent.
 * @throws ApiError 400 for non-integer bounds.
 */
export function createdFilter(query: FormBody): (created: number) => boolean {
  const value = query['created'];
  if (value === undefined) return () => true;
  if (typeof value === 'string') {
    const exact = optionalInteger(query, 'created');
    return (created) => created === exact;
  }
  if (typeof value !== 'object' || value === null) throw invalidParam('created', 'Invalid created');
  const range = value as FormBody;
  const bound = (key: string) => optionalInteger(range, key, { param: `created[${key}]` });
  const [gt, gte, lt, lte] = [bound('gt'), bound('gte'), bound('lt'), bound('lte')];
  return (created) =>
    (gt === undefined || created > gt) &&
    (gte === undefined || created >= gte) &&
    (lt === undefined || created < lt) &&
    (lte === undefined || created <= lte);
}
