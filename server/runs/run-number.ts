import type { Transaction } from 'sequelize';
import type { Sequelize } from 'sequelize';

/** Next value of a per-organization counter (run numbers, report numbers), gap-free within a transaction. */
export async function nextCounter(sequelize: Sequelize, organizationId: string, name: string, transaction: Transaction | null): Promise<number> {
  const [rows] = await sequelize.query(
    `INSERT INTO org_counters (organization_id, name, value) VALUES (:org, :name, 1)
     ON CONFLICT (organization_id, name) DO UPDATE SET value = org_counters.value + 1
     RETURNING value`,
    { replacements: { org: organizationId, name }, transaction: transaction ?? undefined },
  );
  return Number((rows as { value: string }[])[0].value);
}
