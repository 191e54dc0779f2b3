/**
 * A paid checkout session adds its credits exactly once: the purchase row is locked, a completed
 * purchase is left alone, and the ledger row carries the provider's event id (UNIQUE) and the
 * purchase (one 'purchase' row per purchase), so replays and concurrent deliveries credit once.
 * The receipt and its e-mail are written in the same transaction.
 */
import type Stripe from 'stripe';
import type { Transaction } from 'sequelize';
import { CreditLedgerEntry } from '../db/models';
import { audit } from '../audit/audit';
import { creditBalance } from './credit-balance';
import { issueReceipt } from './issue-receipt';
import { lockPurchaseFor } from './lock-purchase';
import type { BillingDeps } from './billing-deps';
import { paymentReceiptEmail } from '../../templates/email/payment-receipt';

export type CompleteOutcome = 'credited' | 'already-completed' | 'needs-review' | 'unknown-session';

/**
 * Complete the purchase of `session` (payment_status 'paid') on behalf of event `eventId`, in
 * the webhook's system transaction `t`. An amount or currency that differs from what the lab
 * priced marks the purchase 'needs-review' and adds nothing.
 */
export async function completePurchase(deps: BillingDeps, t: Transaction, session: Stripe.Checkout.Session, eventId: string): Promise<CompleteOutcome> {
  const purchase = await lockPurchaseFor(session.metadata?.purchaseId, session.id, session);
  if (!purchase) return 'unknown-session';
  if (purchase.status === 'completed') return 'already-completed';
  const paymentIntentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (session.amount_total !== purchase.amountMinor || (session.currency ?? '').toUpperCase() !== purchase.currency) {
    await purchase.update({ status: 'needs-review', paymentIntentId, lastPaymentError: `Paid ${session.amount_total} ${session.currency}, priced ${purchase.amountMinor} ${purchase.currency}.` });
    return 'needs-review';
  }
  await CreditLedgerEntry.create({ organizationId: purchase.organizationId, clientId: purchase.clientId, kind: 'purchase', credits: purchase.credits, reason: `Pack of ${purchase.credits}, checkout ${session.id}`, createdBy: purchase.boughtBy, purchaseId: purchase.id, reportId: null, providerEventId: eventId });
  await purchase.update({ status: 'completed', completedAt: new Date(), checkoutSessionId: session.id, paymentIntentId, lastPaymentError: null });
  const balanceAfter = await creditBalance(deps.sequelize, { labId: purchase.organizationId, clientId: purchase.clientId });
  const { receipt, lab, client, buyer } = await issueReceipt(deps.sequelize, purchase, { paymentReference: paymentIntentId ?? session.id, balanceAfter });
  const mail = paymentReceiptEmail({
    buyerName: buyer?.displayName ?? client.contactName,
    labName: lab.name,
    receiptNumber: receipt.receiptNumber,
    credits: purchase.credits,
    amountMinor: purchase.amountMinor,
    currency: purchase.currency,
    balanceCredits: balanceAfter,
    billingUrl: `${deps.publicUrl}/billing`,
  });
  await deps.enqueueMail(t, {
    to: buyer?.email ?? client.contactEmail,
    ...mail,
    attachments: [{ filename: `${receipt.receiptNumber}.pdf`, contentBase64: receipt.pdf.toString('base64'), contentType: 'application/pdf' }],
  });
  await audit({ organizationId: purchase.organizationId, principal: null, transaction: t }, { action: 'credit-purchase-complete', entity: 'credit-purchase', entityId: purchase.id, after: { eventId, credits: purchase.credits, balanceAfter, receiptNumber: receipt.receiptNumber } });
  return 'credited';
}
