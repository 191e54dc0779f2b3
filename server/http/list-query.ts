import { badRequest } from './problem';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export interface ListQuery {
  page: number;
  pageSize: number;
  sort: string;
  direction: 'ASC' | 'DESC';
  filter: Record<string, string>;
}

/**
 * Read ?page=&pageSize=&sort=field|-field&<filter>= against allow-lists, so a list endpoint never
 * passes anything unchecked to SQL; a filter named `...Id` must be a UUID (400 otherwise).
 */
export function readListQuery(query: Record<string, unknown>, options: { sortable: readonly string[]; filterable: readonly string[]; defaultSort: string }): ListQuery {
  const one = (name: string): string | undefined => {
    const v = query[name];
    if (v === undefined) return undefined;
    if (typeof v !== 'string' || v.length > 200) throw badRequest(`The query parameter "${name}" must be a single short value.`);
    return v;
  };
  const page = Number(one('page') ?? '1');
  const pageSize = Number(one('pageSize') ?? '25');
  if (!Number.isInteger(page) || page < 1 || page > 100_000) throw badRequest('page must be a whole number from 1.');
  if (!Number.isInteger(pageSize) || pageSize < 1 || pageSize > 200) throw badRequest('pageSize must be a whole number from 1 to 200.');
  const sortRaw = one('sort') ?? options.defaultSort;
  const direction = sortRaw.startsWith('-') ? 'DESC' : 'ASC';
  const sort = sortRaw.replace(/^-/, '');
  if (!options.sortable.includes(sort)) throw badRequest(`Cannot sort by "${sort}". Sortable fields: ${options.sortable.join(', ')}.`);
  const filter: Record<string, string> = {};
  for (const name of options.filterable) {
    const v = one(name);
    // An id filter that is not a UUID would only fail in PostgreSQL: say what is wrong instead.
    if (v !== undefined && v !== '' && name.endsWith('Id') && !UUID.test(v)) throw badRequest(`${name} must be an id (a UUID).`);
    if (v !== undefined && v !== '') filter[name] = v;
  }
  return { page, pageSize, sort, direction, filter };
}

export function page<T>(items: T[], total: number, q: ListQuery) {
  return { items, total, page: q.page, pageSize: q.pageSize };
}
