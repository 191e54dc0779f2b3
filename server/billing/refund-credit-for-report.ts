/**
 * Returning the credit of a withdrawn report, when the lab's policy allows it: a new 'refund'
 * row in the ledger (+1), never a change to the consumption row. For the withdraw endpoint.
 */
import { Client, CreditLedgerEntry, Report } from '../db/models';
import { notFound, validationFailed } from '../http/problem';
import { audit } from '../audit/audit';
import { findPriceList } from './price-list';
import { creditBalance } from './credit-balance';
import type { BillingActor } from './billing-deps';

export type RefundOutcome =
  | { refunded: true; clientId: string; balanceAfter: number }
  | { refunded: false; reason: 'no-credit-taken' | 'already-refunded' | 'no-refund-policy' | 'outside-refund-period' };

const DAY_MS = 86_400_000;

/**
 * Give back the credit report `reportId` consumed, with `reason`, in the caller's (the lab's)
 * transaction. Refunded only when the report took a credit, has not been refunded, and was
 * issued no more than the price list's `refundOnWithdrawWithinDays` days ago (measured from
 * issue to now, in whole 24 h days; a lab without that setting gives no refunds). Otherwise the
 * outcome says why and nothing is written. A report of another lab is 404; an empty reason 422.
 * @example await refundCreditForReport(ctx, reportId, 'Withdrawn: wrong serial number') // { refunded: true, clientId, balanceAfter: 3 }
 */
export async function refundCreditForReport(ctx: BillingActor, reportId: string, reason: string): Promise<RefundOutcome> {
  if (reason.trim() === '') throw validationFailed('A refund needs a reason.', [{ pointer: '/reason', message: 'is required' }]);
  const labId = ctx.organizationId!;
  const report = await Report.findOne({ where: { id: reportId, organizationId: labId }, attributes: ['id', 'issuedAt'] });
  if (!report) throw notFound('The report');
  const taken = await CreditLedgerEntry.findOne({ where: { organizationId: labId, reportId, kind: 'consumption' } });
  if (!taken) return { refunded: false, reason: 'no-credit-taken' };
  // Serialise with issues and other refunds of this client (the same lock consumption takes).
  await Client.findOne({ where: { id: taken.clientId, organizationId: labId }, lock: true });
  if (await CreditLedgerEntry.findOne({ where: { organizationId: labId, reportId, kind: 'refund' } })) return { refunded: false, reason: 'already-refunded' };
  const days = (await findPriceList(labId))?.refundOnWithdrawWithinDays ?? null;
  if (days === null) return { refunded: false, reason: 'no-refund-policy' };
  if (Date.now() - report.issuedAt.getTime() > days * DAY_MS) return { refunded: false, reason: 'outside-refund-period' };
  await CreditLedgerEntry.create({ organizationId: labId, clientId: taken.clientId, kind: 'refund', credits: 1, reason: reason.trim().slice(0, 500), createdBy: ctx.principal?.userId ?? null, purchaseId: null, reportId, providerEventId: null });
  const balanceAfter = await creditBalance(Report.sequelize!, { labId, clientId: taken.clientId });
  await audit(ctx, { action: 'credit-refund', entity: 'client', entityId: taken.clientId, after: { reportId, reason, balanceAfter } });
  return { refunded: true, clientId: taken.clientId, balanceAfter };
}
