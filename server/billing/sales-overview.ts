/** The lab's billing overview: what its clients bought (per currency) and each client's balance. */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { ListQuery } from '../http/list-query';

/** Sortable fields of the client balances in GET /billing/sales and their SQL (an allow-list). */
export const BALANCE_SORTS = { name: 'c.name', balance: 'balance', lastActivityAt: '"lastActivityAt"' } as const;

interface ClientBalanceRow {
  clientId: string;
  name: string;
  invoiceLater: boolean;
  balance: string;
  purchased: string;
  consumed: string;
  refunded: string;
  adjusted: string;
  lastActivityAt: Date | null;
  total: string;
}

/**
 * Purchase totals of lab `labId` by currency, and one page of its clients (sortable by name,
 * balance, lastActivityAt; filter `search` on the name) with balance = Σ of all their ledger rows
 * and the sum of each kind: purchased, consumed (credits used by issued reports, as a positive
 * count), refunded, adjusted. Clients without any ledger row show 0.
 */
export async function salesOverview(sequelize: Sequelize, labId: string, q: ListQuery) {
  const totals = await sequelize.query<{ currency: string; completed: string; revenueMinor: string; creditsSold: string; pending: string }>(
    `SELECT currency, count(*) FILTER (WHERE status = 'completed') AS completed, COALESCE(SUM(amount_minor) FILTER (WHERE status = 'completed'), 0) AS "revenueMinor",
            COALESCE(SUM(credits) FILTER (WHERE status = 'completed'), 0) AS "creditsSold", count(*) FILTER (WHERE status = 'pending') AS pending
       FROM credit_purchases WHERE organization_id = :labId GROUP BY currency ORDER BY currency`,
    { replacements: { labId }, type: QueryTypes.SELECT },
  );
  const search = q.filter.search ? 'AND c.name ILIKE :like' : '';
  const rows = await sequelize.query<ClientBalanceRow>(
    `SELECT c.id AS "clientId", c.name, c.invoice_later AS "invoiceLater",
            COALESCE(SUM(l.credits), 0) AS balance,
            COALESCE(SUM(l.credits) FILTER (WHERE l.kind = 'purchase'), 0) AS purchased,
            COALESCE(-SUM(l.credits) FILTER (WHERE l.kind = 'consumption'), 0) AS consumed,
            COALESCE(SUM(l.credits) FILTER (WHERE l.kind = 'refund'), 0) AS refunded,
            COALESCE(SUM(l.credits) FILTER (WHERE l.kind = 'adjustment'), 0) AS adjusted,
            max(l.created_at) AS "lastActivityAt", count(*) OVER () AS total
       FROM clients c LEFT JOIN credit_ledger l ON l.organization_id = c.organization_id AND l.client_id = c.id
      WHERE c.organization_id = :labId ${search}
      GROUP BY c.id ORDER BY ${BALANCE_SORTS[q.sort as keyof typeof BALANCE_SORTS] ?? 'c.name'} ${q.direction} NULLS LAST, c.id LIMIT :limit OFFSET :offset`,
    { replacements: { labId, like: `%${(q.filter.search ?? '').replace(/[%_\\]/g, '\\$&')}%`, limit: q.pageSize, offset: (q.page - 1) * q.pageSize }, type: QueryTypes.SELECT },
  );
  return {
    totals: totals.map((t) => ({ currency: t.currency, completedPurchases: Number(t.completed), revenueMinor: Number(t.revenueMinor), creditsSold: Number(t.creditsSold), pendingPurchases: Number(t.pending) })),
    clients: {
      items: rows.map((r) => ({
        clientId: r.clientId,
        name: r.name,
        invoiceLater: r.invoiceLater,
        balance: Number(r.balance),
        purchased: Number(r.purchased),
        consumed: Number(r.consumed),
        refunded: Number(r.refunded),
        adjusted: Number(r.adjusted),
        lastActivityAt: r.lastActivityAt ? new Date(r.lastActivityAt).toISOString() : null,
      })),
      total: rows.length ? Number(rows[0].total) : 0,
      page: q.page,
      pageSize: q.pageSize,
    },
  };
}
