/**
 * Purchases of report credits, paginated, sorted and filtered on the server: a lab sees what its
 * clients bought from it, a manufacturer what it bought. The side decides the leading predicate
 * (organization_id or buyer_organization_id), so the matching index applies; row-level security
 * still admits only rows the caller may read.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { badRequest } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import type { BillingSide } from './billing-side';
import type { PurchaseRow } from './purchase-presenter';

/** Sortable fields of GET /billing/purchases and their columns (an allow-list: nothing else reaches SQL). */
export const PURCHASE_SORTS = { createdAt: 'p.created_at', amountMinor: 'p.amount_minor', status: 'p.status' } as const;
/** Query filters of GET /billing/purchases. */
export const PURCHASE_FILTERS = ['status', 'clientId', 'labId'] as const;
const STATUSES = ['pending', 'completed', 'expired', 'needs-review'];
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

const SELECT = `SELECT p.id, p.organization_id AS "labId", lab.name AS "labName", p.client_id AS "clientId", c.name AS "clientName",
       p.pack_id AS "packId", p.credits, p.amount_minor AS "amountMinor", p.currency, p.status, p.last_payment_error AS "lastPaymentError",
       r.receipt_number AS "receiptNumber", p.created_at AS "createdAt", p.completed_at AS "completedAt"
  FROM credit_purchases p
  JOIN organizations lab ON lab.id = p.organization_id
  JOIN clients c ON c.id = p.client_id
  LEFT JOIN credit_receipts r ON r.purchase_id = p.id`;

/** One page of purchases for `organizationId` on `side`, with the total count. 400 for a malformed filter. */
export async function listPurchases(sequelize: Sequelize, side: BillingSide, organizationId: string, q: ListQuery): Promise<{ items: PurchaseRow[]; total: number }> {
  const where = [side === 'lab' ? 'p.organization_id = :org' : 'p.buyer_organization_id = :org'];
  const { status, clientId, labId } = q.filter;
  if (status !== undefined) {
    if (!STATUSES.includes(status)) throw badRequest(`status must be one of ${STATUSES.join(', ')}.`);
    where.push('p.status = :status');
  }
  for (const [name, value] of [['clientId', clientId], ['labId', labId]] as const) {
    if (value !== undefined && !UUID.test(value)) throw badRequest(`${name} must be a UUID.`);
  }
  if (clientId !== undefined) where.push('p.client_id = :clientId');
  if (labId !== undefined) where.push('p.organization_id = :labId');
  const order = `${PURCHASE_SORTS[q.sort as keyof typeof PURCHASE_SORTS] ?? 'p.created_at'} ${q.direction}, p.id`;
  const rows = await sequelize.query<PurchaseRow & { total: string }>(`${SELECT.replace('SELECT ', 'SELECT count(*) OVER () AS total, ')} WHERE ${where.join(' AND ')} ORDER BY ${order} LIMIT :limit OFFSET :offset`, {
    replacements: { org: organizationId, ...q.filter, limit: q.pageSize, offset: (q.page - 1) * q.pageSize },
    type: QueryTypes.SELECT,
  });
  return { total: rows.length ? Number(rows[0].total) : 0, items: rows.map(({ total: _total, ...row }) => row) };
}

/** One purchase the caller may read, or null (another organization's purchase is simply not there). */
export async function findPurchase(sequelize: Sequelize, side: BillingSide, organizationId: string, id: string): Promise<PurchaseRow | null> {
  if (!UUID.test(id)) return null;
  const rows = await sequelize.query<PurchaseRow>(`${SELECT} WHERE p.id = :id AND ${side === 'lab' ? 'p.organization_id' : 'p.buyer_organization_id'} = :org`, {
    replacements: { id, org: organizationId },
    type: QueryTypes.SELECT,
  });
  return rows[0] ?? null;
}
