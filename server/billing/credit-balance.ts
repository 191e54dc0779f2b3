/**
 * A client's report credits at a lab: the SUM of the signed ledger rows of that (lab, client),
 * never a stored counter, so the balance cannot drift from its history.
 */
import { QueryTypes, type Sequelize } from 'sequelize';

/**
 * balance = Σ credits over credit_ledger rows with this lab and client (0 with no rows).
 * Runs in the caller's transaction (row-level security applies: a caller who may not read the
 * rows gets 0). Units: report credits, an integer; negative for an invoice-later client that
 * has used more credits than it bought.
 * @example await creditBalance(sequelize, { labId, clientId }) // 3
 */
export async function creditBalance(sequelize: Sequelize, key: { labId: string; clientId: string }): Promise<number> {
  const [row] = await sequelize.query<{ balance: string }>(
    'SELECT COALESCE(SUM(credits), 0) AS balance FROM credit_ledger WHERE organization_id = :labId AND client_id = :clientId',
    { replacements: key, type: QueryTypes.SELECT },
  );
  return Number(row.balance);
}
