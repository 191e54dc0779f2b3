/**
 * Tenant isolation, enforced by PostgreSQL row-level security (see migration 0001): every
 * tenant-owned table admits only rows whose organization_id equals the transaction-local setting
 * `app.org_id`. A request runs in one transaction that sets it first; a query made outside any
 * tenant transaction sees no tenant rows at all, so forgetting the scope fails closed.
 */
import type { Sequelize, Transaction } from 'sequelize';

export async function inTenant<T>(sequelize: Sequelize, organizationId: string | null, fn: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction(async (t) => {
    await sequelize.query("SELECT set_config('app.org_id', :org, true)", { replacements: { org: organizationId ?? '' }, transaction: t });
    return fn(t);
  });
}

/**
 * Work that legitimately spans organizations (public verification, payment webhooks, mail jobs,
 * demo seeding). Each caller is named in DEVELOPERS.md; route handlers never use it directly.
 */
export async function asSystem<T>(sequelize: Sequelize, fn: (t: Transaction) => Promise<T>): Promise<T> {
  return sequelize.transaction(async (t) => {
    await sequelize.query("SELECT set_config('app.system', 'on', true)", { transaction: t });
    return fn(t);
  });
}
