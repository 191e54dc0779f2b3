/**
 * A manufacturer's accounts at the labs it is a client of (clients.client_organization_id = it):
 * the balance at each, and for the offers page the lab's packs. Read through the narrow
 * row-level-security policies of migration 0004, in the manufacturer's own tenant transaction.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { StoredCreditPack } from '../db/models/credit-price-list';
import { presentPack } from './price-list';

interface AccountRow {
  labId: string;
  labName: string;
  clientId: string;
  clientName: string;
  invoiceLater: boolean;
  balance: string;
  lastActivityAt: Date | null;
  currency: string | null;
  packs: StoredCreditPack[] | null;
}

/**
 * One row per lab (its oldest client record naming the manufacturer, the one checkouts credit),
 * ordered by lab name: balance = Σ ledger credits of that client record, and the lab's packs
 * (empty when it sells none).
 */
export async function manufacturerAccounts(sequelize: Sequelize, manufacturerId: string) {
  const rows = await sequelize.query<AccountRow>(
    `SELECT DISTINCT ON (lab.name, lab.id) lab.id AS "labId", lab.name AS "labName", c.id AS "clientId", c.name AS "clientName", c.invoice_later AS "invoiceLater",
            (SELECT COALESCE(SUM(l.credits), 0) FROM credit_ledger l WHERE l.organization_id = c.organization_id AND l.client_id = c.id) AS balance,
            (SELECT max(l.created_at) FROM credit_ledger l WHERE l.organization_id = c.organization_id AND l.client_id = c.id) AS "lastActivityAt",
            pl.currency, pl.packs
       FROM clients c
       JOIN organizations lab ON lab.id = c.organization_id AND lab.kind = 'lab'
       LEFT JOIN credit_price_lists pl ON pl.organization_id = c.organization_id
      WHERE c.client_organization_id = :manufacturerId
      ORDER BY lab.name, lab.id, c.created_at, c.id`,
    { replacements: { manufacturerId }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    lab: { id: r.labId, name: r.labName },
    clientId: r.clientId,
    clientName: r.clientName,
    invoiceLater: r.invoiceLater,
    balance: Number(r.balance),
    lastActivityAt: r.lastActivityAt ? new Date(r.lastActivityAt).toISOString() : null,
    currency: r.currency,
    packs: r.currency && r.packs ? r.packs.map((p) => presentPack(p, r.currency!)) : [],
  }));
}
