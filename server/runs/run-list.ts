/**
 * The lab's run list: one statement that takes a page of test_runs
 * by an index led by the organization, joins only that page to its plan and device, and carries
 * the total. Sort and search keys live on the run (migration 0010), so no sort or filter needs
 * the join; a total for no filter or states alone comes from the per-state counts.
 */
import type { Transaction } from 'sequelize';
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
  updatedAt: Date;
  createdAt: Date;
  engineerId: string | null;
  planName: string;
  manufacturer: string;
  model: string;
  serialNumber: string;
  client: string;
}

/** `%`, `_` and `\` in a search are characters to find, not wildcards. */
function likePattern(search: string): string {
  return `%${search.replace(/[%_\\]/g, '\\$&')}%`;
}

export async function listRuns(transaction: Transaction, organizationId: string, q: ListQuery) {
  const states = q.filter.state?.split(',') ?? [];
  if (states.some((s) => !(RUN_STATES as readonly string[]).includes(s))) throw badRequest(`Unknown state in "${q.filter.state}".`);
  const values: unknown[] = [organizationId];
  const param = (value: unknown) => `$${values.push(value)}`;
  // The organization is named explicitly so the (organization_id, ...) indexes serve the query;
  // row-level security still guards every row.
  const where = ['r.organization_id = $1'];
  // One state is an equality, so an (organization_id, state, ...) index also gives the order.
  const stateIs = !states.length ? '' : states.length === 1 ? `state = ${param(states[0])}::text` : `state = ANY(${param(states)}::text[])`;
  if (stateIs) where.push(`r.${stateIs}`);
  if (q.filter.engineerId) where.push(`r.engineer_id = ${param(q.filter.engineerId)}::uuid`);
  if (q.filter.search) where.push(`r.search_text LIKE lower(${param(likePattern(q.filter.search))})`);
  const column = RUN_SORT_COLUMNS[q.sort];
  const order = `r.${column} ${q.direction}, r.id ${q.direction}`;
  const total =
    q.filter.engineerId || q.filter.search
      ? `SELECT count(*) AS n FROM test_runs r WHERE ${where.join(' AND ')}`
      : `SELECT coalesce(sum(n), 0) AS n FROM run_state_counts WHERE organization_id = $1${stateIs ? ` AND ${stateIs}` : ''}`;
  const limit = param(q.pageSize);
  const offset = param((q.page - 1) * q.pageSize);
  const columns = `r.id, r.number, r.state, r.updated_at AS "updatedAt", r.created_at AS "createdAt", r.engineer_id AS "engineerId",
            p.name AS "planName", d.manufacturer, d.model, d.serial_number AS "serialNumber", r.client_name AS client`;
  const joins = `JOIN test_plans p ON p.organization_id = $1 AND p.id = r.plan_id
       JOIN devices d ON d.organization_id = $1 AND d.id = p.device_id`;
  // A search cannot use an index (see migration 0010): the matching runs are read once, with the
  // sort key (newest first: from the index alone), then counted and paged; only the page's runs
  // are read from the table. Otherwise the total is an uncorrelated subquery, evaluated once.
  const sql = q.filter.search
    ? `WITH matched AS MATERIALIZED (SELECT r.id, r.${column} AS k FROM test_runs r WHERE ${where.join(' AND ')})
       SELECT (SELECT count(*) FROM matched) AS total, ${columns}
         FROM (SELECT m.id FROM matched m ORDER BY m.k ${q.direction}, m.id ${q.direction} LIMIT ${limit} OFFSET ${offset}) pg
         JOIN test_runs r ON r.organization_id = $1 AND r.id = pg.id
         ${joins}
        ORDER BY ${order}`
    : `SELECT (${total}) AS total, ${columns}
         FROM (SELECT r.id, r.plan_id, r.number, r.state, r.updated_at, r.created_at, r.engineer_id, r.client_name, r.device_model
                 FROM test_runs r WHERE ${where.join(' AND ')} ORDER BY ${order} LIMIT ${limit} OFFSET ${offset}) r
         ${joins}
        ORDER BY ${order}`;
  // Planned for its values each time (server/db/prepared-query.ts): the best plan for a rare
  // state or a search differs from the one for the whole list.
  const rows = await preparedRows<RunListItem & { total: string }>(transaction, sql, values, { unnamed: true });
  if (rows.length) return page(rows.map(({ total: _total, ...item }) => item), Number(rows[0].total), q);
  // An empty page: no match at all on page 1, or a page past the end (its total still counts).
  if (q.page === 1) return page([], 0, q);
  const [counted] = await preparedRows<{ n: string }>(transaction, total, values.slice(0, values.length - 2), { unnamed: true });
  return page([], Number(counted.n), q);
}
