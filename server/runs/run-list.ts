/**
 * The lab's run list: one statement that takes a page of test_runs
 * by an index led by the organization, joins only that page to its plan and device, and carries
 * the total. Sort and search keys live on the run (migration 0010), so no sort or filter needs
 * the join; a total for no filter or states alone comes from the per-state counts.
 */
import type { Transaction } from 'sequelize';
import { isoText } from '../db/iso-text';
import { preparedRows } from '../db/prepared-query';
import { badRequest } from '../http/problem';
import { page, type ListQuery } from '../http/list-query';
import { RUN_STATES } from '../../shared/runs/run-state';

/** The sortable fields and their columns on test_runs; ties are broken by id in the same direction. */
export const RUN_SORT_COLUMNS: Record<string, string> = {
  number: 'number',
  state: 'state',
  updatedAt: 'updated_at',
  createdAt: 'created_at',
  model: 'device_model',
  client: 'client_name',
};
export const RUN_FILTERS = ['state', 'search', 'engineerId'] as const;

export interface RunListItem {
  id: string;
  number: string;
  state: string;
  /** ISO 8601 (db/iso-text.ts) */
  updatedAt: string;
  createdAt: string;
  engineerId: string | null;
  planName: string;
  manufacturer: string;
  model: string;
  serialNumber: string;
  client: string;
}

const MAX_SEARCH_WORDS = 8;
/** Page sizes the screens offer: their lists are named statements with the size written in (listRuns). */
const GENERIC_PAGE_SIZES = new Set([10, 25, 50, 100]);
/** Above this many runs matching a search, the list reads runs in its order and checks each against the matches. */
const MANY_MATCHES = 300;
const HASHED_MATCHES = 20_000;

/** The distinct words of a search (split at spaces); a run matches when every word begins one of its terms. */
function searchWords(search: string | undefined): string[] {
  if (!search) return [];
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(search)) throw badRequest('The search cannot contain control characters.');
  const words = [...new Set(search.trim().split(/\s+/).filter(Boolean))];
  if (words.length > MAX_SEARCH_WORDS) throw badRequest(`Search with at most ${MAX_SEARCH_WORDS} words.`);
  return words;
}

export async function listRuns(transaction: Transaction, organizationId: string, q: ListQuery) {
  const states = q.filter.state?.split(',') ?? [];
  if (states.some((s) => !(RUN_STATES as readonly string[]).includes(s))) throw badRequest(`Unknown state in "${q.filter.state}".`);
  const values: unknown[] = [organizationId];
  const param = (value: unknown) => `$${values.push(value)}`;
  // Each word of a search must begin one of the run's search terms (migration 0010): the runs
  // whose terms match every word, from the terms' primary key alone ($2, $3 ...).
  const words = searchWords(q.filter.search);
  const matched = words
    .map((word) => {
      const w = param(word);
      return `SELECT t.run_id FROM run_search_terms t WHERE t.organization_id = $1 AND t.term >= lower(${w}) AND t.term < lower(${w}) || chr(1114111)`;
    })
    .join(' INTERSECT ');
  let matches = 0;
  if (matched) {
    const [counted] = await preparedRows<{ n: string }>(transaction, `SELECT count(DISTINCT m.run_id) AS n FROM (${matched}) m`, values.slice(), { unnamed: true });
    matches = Number(counted.n);
    if (matches === 0) return page([], 0, q);
  }
  // The organization is named explicitly so the (organization_id, ...) indexes serve the query;
  // row-level security still guards every row.
  const where = ['r.organization_id = $1'];
  // A few matches are read by id. Many are checked against a hashed set while the runs are read
  // in the order of the list, which stops at the page: "OR false" keeps PostgreSQL from turning
  // the set into a join (it only flattens a sublink that stands alone), and it misjudges that
  // join here, reading every match by id (about 10 ms for 2,000 matches; the hashed set, 2 ms).
  // Past HASHED_MATCHES the set might not fit in memory as a hash: back to the join.
  const hashed = matches > MANY_MATCHES && matches <= HASHED_MATCHES;
  if (matched) where.push(hashed ? `(r.id IN (${matched}) OR false)` : `r.id IN (${matched})`);
  // Most lists (no search, at most one state, a page size the screens offer) are named statements
  // with their state, sort and page size written in, and run with PostgreSQL's generic plan
  // (preparedRows' `genericPlan`): planned once per connection, where planning for each request's values
  // took about 0.5 ms, a third of the statement's time under load. The state is in the text, so a
  // rare state still has a plan of its own, and the shapes stay few (sorts x states x engineer
  // filter x page sizes). A search or several states are planned for their values each time
  // (server/db/prepared-query.ts): their best plan depends on how many runs match, and a generic
  // plan measured several times slower on later pages of two states.
  const generic = !matched && states.length <= 1 && GENERIC_PAGE_SIZES.has(q.pageSize);
  // One state is an equality, so an (organization_id, state, ...) index also gives the order.
  const stateIs = !states.length
    ? ''
    : states.length > 1
      ? `state = ANY(${param(states)}::text[])`
      : generic
        ? `state = '${states[0]}'` // one of RUN_STATES, checked above
        : `state = ${param(states[0])}::text`;
  if (stateIs) where.push(`r.${stateIs}`);
  if (q.filter.engineerId) where.push(`r.engineer_id = ${param(q.filter.engineerId)}::uuid`);
  const column = RUN_SORT_COLUMNS[q.sort];
  const order = `r.${column} ${q.direction}, r.id ${q.direction}`;
  // A search alone has its total already; other filters count their runs; no filter, or states
  // alone, read the per-state counts.
  const searchOnly = !!matched && !stateIs && !q.filter.engineerId;
  const total = searchOnly
    ? null
    : matched || q.filter.engineerId
      ? `SELECT count(*) AS n FROM test_runs r WHERE ${where.join(' AND ')}`
      : `SELECT coalesce(sum(n), 0) AS n FROM run_state_counts WHERE organization_id = $1${stateIs ? ` AND ${stateIs}` : ''}`;
  const limit = generic ? String(q.pageSize) : param(q.pageSize);
  const offset = param((q.page - 1) * q.pageSize);
  // The total is an uncorrelated subquery: PostgreSQL evaluates it once per statement (an InitPlan).
  // The page is joined to it, so a page past the end still answers one row, with the total: this
  // statement is always the request's last, and its COMMIT goes with it (server/db/prepared-query.ts).
  const sql = `SELECT t.total, x.id, x.number, x.state, ${isoText('x.updated_at')} AS "updatedAt", ${isoText('x.created_at')} AS "createdAt", x.engineer_id AS "engineerId",
            x.plan_name AS "planName", x.manufacturer, x.model, x.serial_number AS "serialNumber", x.client_name AS client
       FROM (SELECT ${total ? `(${total})` : 'NULL'} AS total) t
       LEFT JOIN (SELECT r.id, r.number, r.state, r.updated_at, r.created_at, r.engineer_id, r.client_name, r.device_model,
                         p.name AS plan_name, d.manufacturer, d.model, d.serial_number
                    FROM (SELECT r.id, r.plan_id, r.number, r.state, r.updated_at, r.created_at, r.engineer_id, r.client_name, r.device_model
                            FROM test_runs r WHERE ${where.join(' AND ')} ORDER BY ${order} LIMIT ${limit} OFFSET ${offset}) r
                    JOIN test_plans p ON p.organization_id = $1 AND p.id = r.plan_id
                    JOIN devices d ON d.organization_id = $1 AND d.id = p.device_id) x ON true
      ORDER BY x.${column} ${q.direction}, x.id ${q.direction}`;
  const rows = await preparedRows<(RunListItem & { total: string | null }) | { total: string | null; id: null }>(transaction, sql, values, { unnamed: !generic, genericPlan: generic, thenCommit: true });
  const known = rows[0].total === null ? matches : Number(rows[0].total);
  const items = rows.filter((row): row is RunListItem & { total: string | null } => row.id !== null).map(({ total: _total, ...item }) => item);
  return page(items, known, q);
}
