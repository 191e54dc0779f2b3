/**
 * The credit ledger as a statement: each row with the balance after it (a running SUM over the
 * rows of its lab and client, oldest first). A lab reads its clients' rows, a manufacturer the
 * rows of the client records that name it at every lab.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { badRequest } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import type { BillingSide } from './billing-side';

/** Query filters of GET /billing/ledger (a lab filters by client, a manufacturer by lab). */
export const LEDGER_FILTERS = ['clientId', 'labId'] as const;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

interface LedgerRow {
  id: string;
  labId: string;
  labName: string;
  clientId: string;
  clientName: string;
  kind: string;
  credits: number;
  reason: string | null;
  reportId: string | null;
  reportNumber: string | null;
  purchaseId: string | null;
  createdByName: string | null;
  createdAt: Date;
  balanceAfter: string;
  total: string;
}

/** One page of ledger rows for `organizationId` on `side`, newest first unless sorted `createdAt`. 400 for a malformed filter. */
export async function listLedger(sequelize: Sequelize, side: BillingSide, organizationId: string, q: ListQuery) {
  for (const name of LEDGER_FILTERS) {
    if (q.filter[name] !== undefined && !UUID.test(q.filter[name])) throw badRequest(`${name} must be a UUID.`);
  }
  const where = [side === 'lab' ? 'l.organization_id = :org' : 'c.client_organization_id = :org'];
  if (q.filter.clientId) where.push('l.client_id = :clientId');
  if (q.filter.labId) where.push('l.organization_id = :labId');
  const rows = await sequelize.query<LedgerRow>(
    `SELECT l.id, l.organization_id AS "labId", lab.name AS "labName", l.client_id AS "clientId", c.name AS "clientName", l.kind, l.credits, l.reason,
            l.report_id AS "reportId", r.report_number AS "reportNumber", l.purchase_id AS "purchaseId", u.display_name AS "createdByName", l.created_at AS "createdAt",
            SUM(l.credits) OVER (PARTITION BY l.organization_id, l.client_id ORDER BY l.created_at, l.id) AS "balanceAfter",
            count(*) OVER () AS total
       FROM credit_ledger l
       JOIN clients c ON c.id = l.client_id AND c.organization_id = l.organization_id
       JOIN organizations lab ON lab.id = l.organization_id
       LEFT JOIN reports r ON r.id = l.report_id
       LEFT JOIN users u ON u.id = l.created_by
      WHERE ${where.join(' AND ')}
      ORDER BY l.created_at ${q.direction}, l.id ${q.direction} LIMIT :limit OFFSET :offset`,
    { replacements: { org: organizationId, ...q.filter, limit: q.pageSize, offset: (q.page - 1) * q.pageSize }, type: QueryTypes.SELECT },
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    items: rows.map(({ total: _total, balanceAfter, createdAt, labId, labName, clientId, clientName, ...row }) => ({
      ...row,
      lab: { id: labId, name: labName },
      client: { id: clientId, name: clientName },
      balanceAfter: Number(balanceAfter),
      createdAt: new Date(createdAt).toISOString(),
    })),
  };
}
