/**
 * Issuing a report uses one report credit of the client at the lab, in the issue's own
 * transaction: if the issue fails afterwards (rendering, signing, storing), the credit comes back
 * with the rollback, and a credit is never taken for a report that does not exist.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { Client, CreditLedgerEntry, Organization } from '../db/models';
import { conflict } from '../http/problem';
import { audit } from '../audit/audit';
import { findPriceList } from './price-list';
import { creditBalance } from './credit-balance';
import type { BillingActor, CreditMailDeps } from './billing-deps';
import { lowCreditEmail } from '../../templates/email/low-credit';

/** At or below this balance after a report, the client's contact is told (common practice: warn before the last credit is gone). */
export const LOW_CREDIT_THRESHOLD = 1;

export type ConsumeOutcome =
  | { consumed: true; clientId: string; balanceAfter: number }
  | { consumed: false; reason: 'lab-sells-no-credits' | 'correction' };

/**
 * Take one credit of the run's client for report `reportId` (the id the report row will get in
 * this same transaction; the ledger's foreign key to it is checked at commit). Nothing is taken
 * when the lab has no price list, or for a corrected revision (revision > 1) of a report already
 * issued. With no credit left the issue is refused with 409 `no-report-credits`, unless the
 * client is marked invoice-later: then the balance goes below zero and the lab invoices it.
 * A balance of LOW_CREDIT_THRESHOLD or less afterwards enqueues the low-credit e-mail.
 * The client row is locked (FOR UPDATE) so two issues at once cannot both take the last credit.
 * @example await consumeCreditForReport(deps, ctx, { runId, reportId, revision: 1 }) // { consumed: true, clientId, balanceAfter: 2 }
 */
export async function consumeCreditForReport(deps: CreditMailDeps & { sequelize: Sequelize }, ctx: BillingActor, input: { runId: string; reportId: string; revision: number }): Promise<ConsumeOutcome> {
  const labId = ctx.organizationId!;
  if (!(await findPriceList(labId))) return { consumed: false, reason: 'lab-sells-no-credits' };
  if (input.revision > 1) return { consumed: false, reason: 'correction' };
  const rows = await deps.sequelize.query<{ clientId: string }>(
    `SELECT d.client_id AS "clientId" FROM test_runs r JOIN test_plans p ON p.id = r.plan_id JOIN devices d ON d.id = p.device_id
      WHERE r.id = :runId AND r.organization_id = :labId`,
    { replacements: { runId: input.runId, labId }, type: QueryTypes.SELECT },
  );
  const client = rows[0] && (await Client.findOne({ where: { id: rows[0].clientId, organizationId: labId }, lock: true }));
  if (!client) throw conflict('The run has no client record at this lab, so no report credit can be taken.', { code: 'no-client' });
  const balance = await creditBalance(deps.sequelize, { labId, clientId: client.id });
  if (balance < 1 && !client.invoiceLater) {
    throw conflict(
      `${client.name} has no report credits left with this lab; ask them to buy credits under Billing, or mark the client "invoice later" to issue now and invoice afterwards.`,
      { code: 'no-report-credits' },
    );
  }
  await CreditLedgerEntry.create({ organizationId: labId, clientId: client.id, kind: 'consumption', credits: -1, reason: null, createdBy: ctx.principal?.userId ?? null, purchaseId: null, reportId: input.reportId, providerEventId: null });
  const balanceAfter = balance - 1;
  await audit(ctx, { action: 'credit-consume', entity: 'client', entityId: client.id, after: { reportId: input.reportId, balanceBefore: balance, balanceAfter } });
  if (balanceAfter <= LOW_CREDIT_THRESHOLD && !client.invoiceLater) {
    const lab = (await Organization.findByPk(labId))!;
    const mail = lowCreditEmail({ contactName: client.contactName, clientName: client.name, labName: lab.name, balanceCredits: balanceAfter, billingUrl: `${deps.publicUrl}/billing` });
    await deps.enqueueMail(ctx.transaction, { to: client.contactEmail, ...mail });
  }
  return { consumed: true, clientId: client.id, balanceAfter };
}
