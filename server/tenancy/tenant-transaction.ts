/**
 * Tenant isolation, enforced by PostgreSQL row-level security (see migration 0001): every
 * tenant-owned table admits only rows whose organization_id equals the transaction-local setting
 * `app.org_id`. A request runs in one transaction that sets it first; a query made outside any
 * tenant transaction sees no tenant rows at all, so forgetting the scope fails closed.
 */
import type { Sequelize, Transaction } from 'sequelize';
import type { Role } from '../../shared/access/roles';
import { preparedRows } from '../db/prepared-query';

export async function inTenant<T>(
  sequelize: Sequelize,
  organizationId: string | null,
  fn: (t: Transaction, roles: Role[] | null) => Promise<T>,
  /** Also read, in the same statement, the roles this person holds in the organization now. */
  memberId: string | null = null,
): Promise<T> {
  return sequelize.transaction(async (t) => {
    const [row] = await preparedRows<{ roles: Role[] | null }>(t, TENANT_SETUP, [organizationId ?? '', memberId]);
    return fn(t, row.roles);
  });
}

/** The tenant setting and (memberships have no row-level security) the caller's current roles, in one round trip. */
const TENANT_SETUP = `SELECT set_config('app.org_id', $1, true) AS org,
  CASE WHEN $2::uuid IS NULL THEN NULL ELSE ARRAY(SELECT role FROM memberships WHERE user_id = $2::uuid AND organization_id = nullif($1, '')::uuid) END AS roles`;

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
