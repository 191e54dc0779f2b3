/** A purchase as both sides see it, with one sentence that tells the buyer where it stands. */
import type { CreditPurchaseStatus } from '../db/models/credit-purchase';
import { formatMoney } from '../../templates/receipt/format-money';

/** The columns list-purchases.ts selects for each purchase. */
export interface PurchaseRow {
  id: string;
  labId: string;
  labName: string;
  clientId: string;
  clientName: string;
  packId: string;
  credits: number;
  amountMinor: number;
  currency: string;
  status: CreditPurchaseStatus;
  lastPaymentError: string | null;
  receiptNumber: string | null;
  createdAt: Date;
  completedAt: Date | null;
}

/**
 * The message the app shows when the buyer comes back from the payment page (and in lists).
 * @example purchaseMessage({ status: 'pending', lastPaymentError: 'Your card was declined.', ... })
 *   // 'The payment did not go through: Your card was declined. No credits were added; you can try again with another card.'
 */
export function purchaseMessage(p: Pick<PurchaseRow, 'status' | 'lastPaymentError' | 'credits' | 'labName'>): string {
  const credits = `${p.credits} report credit${p.credits === 1 ? '' : 's'}`;
  switch (p.status) {
    case 'completed':
      return `Paid: ${credits} added to your balance with ${p.labName}.`;
    case 'expired':
      return 'The payment page expired before anything was paid. No credits were added.';
    case 'needs-review':
      return 'The payment is being checked; the credits are added once it is confirmed.';
    default: {
      if (p.lastPaymentError) {
        const reason = p.lastPaymentError.replace(/\.?$/, '.');
        return `The payment did not go through: ${reason} No credits were added; you can try again with another card.`;
      }
      return `Waiting for the payment to be confirmed. No credits have been added yet.`;
    }
  }
}

export function presentPurchase(p: PurchaseRow) {
  return {
    id: p.id,
    lab: { id: p.labId, name: p.labName },
    client: { id: p.clientId, name: p.clientName },
    packId: p.packId,
    credits: p.credits,
    amountMinor: p.amountMinor,
    currency: p.currency,
    amountText: formatMoney(p.amountMinor, p.currency),
    status: p.status,
    message: purchaseMessage(p),
    receiptNumber: p.receiptNumber,
    receiptPath: p.receiptNumber ? `/api/billing/purchases/${p.id}/receipt` : null,
    createdAt: new Date(p.createdAt).toISOString(),
    completedAt: p.completedAt ? new Date(p.completedAt).toISOString() : null,
  };
}
