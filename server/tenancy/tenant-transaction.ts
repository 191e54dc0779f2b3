/**
 * Tenant isolation, enforced by PostgreSQL row-level security (see migration 0001): every
 * tenant-owned table admits only rows whose organization_id equals the transaction-local setting
 * `app.org_id`. A request runs in one transaction that sets it first; a query made outside any
 * tenant transaction sees no tenant rows at all, so forgetting the scope fails closed.
 */
import { Sequelize, Transaction } from 'sequelize';
import type { Role } from '../../shared/access/roles';
import { preparedRows, sendStatement, writtenTogether } from '../db/prepared-query';

export async function inTenant<T>(
  sequelize: Sequelize,
  organizationId: string | null,
  fn: (t: Transaction, roles: Role[] | null) => Promise<T>,
  /** Also read, in the same statement, the roles this person holds in the organization now. */
  memberId: string | null = null,
): Promise<T> {
  return transactionFrom(
    sequelize,
    (t) => preparedRows<{ roles: Role[] | null }>(t, TENANT_SETUP, [organizationId ?? '', memberId]),
    (t, [row]) => fn(t, row.roles),
  );
}

/** The tenant setting and (memberships have no row-level security) the caller's current roles, in one round trip. */
const TENANT_SETUP = `SELECT set_config('app.org_id', $1, true) AS org,
  CASE WHEN $2::uuid IS NULL THEN NULL ELSE ARRAY(SELECT role FROM memberships WHERE user_id = $2::uuid AND organization_id = nullif($1, '')::uuid) END AS roles`;

/**
 * Work that legitimately spans organizations (public verification, payment webhooks, mail jobs,
 * demo seeding). Each caller is named in DEVELOPERS.md; route handlers never use it directly.
 */
export async function asSystem<T>(sequelize: Sequelize, fn: (t: Transaction) => Promise<T>): Promise<T> {
  return transactionFrom(sequelize, (t) => preparedRows(t, "SELECT set_config('app.system', 'on', true)", []), (t) => fn(t));
}

/** Sequelize's Transaction, with the members (undeclared in its types) that starting it here uses. */
type OpenedHere = Transaction & { begin: () => Promise<unknown>; prepareEnvironment(useCls: boolean): Promise<unknown>; finished?: string };

/**
 * sequelize.transaction(fn), with the transaction's first statement written together with its
 * START TRANSACTION (pipeline mode, db/sequelize.ts): one round trip where there were two. Model
 * queries inside join it through the request scope (db/request-scope.ts) as before. When `fn`'s
 * last statement already committed (preparedRows' `thenCommit`), there is nothing left to commit.
 */
async function transactionFrom<S, T>(sequelize: Sequelize, first: (t: Transaction) => Promise<S>, fn: (t: Transaction, first: S) => Promise<T>): Promise<T> {
  const transaction = new Transaction(sequelize, {}) as OpenedHere;
  let firstDone: Promise<S> | undefined;
  transaction.begin = async () => {
    const begun = writtenTogether(transaction, () => {
      const started = sendStatement(transaction, 'START TRANSACTION');
      firstDone = first(transaction);
      return started;
    });
    firstDone!.catch(() => undefined); // answered below, once the transaction has begun
    await begun;
  };
  const cls = Sequelize as unknown as { _clsRun<R>(fn: () => R): R };
  return cls._clsRun(async () => {
    await transaction.prepareEnvironment(true);
    let result: T;
    try {
      result = await fn(transaction, await firstDone!);
    } catch (error) {
      if (!transaction.finished) await transaction.rollback().catch(() => undefined);
      throw error;
    }
    if (!transaction.finished) await transaction.commit();
    return result;
  });
}
