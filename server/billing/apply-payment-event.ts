/**
 * What each verified provider event does to our records. Only a paid checkout session adds
 * credits; the other events note progress on a purchase that is still pending and never undo a
 * completed one, so events may arrive in any order and any number of times.
 */
import type Stripe from 'stripe';
import type { Transaction } from 'sequelize';
import { completePurchase } from './complete-purchase';
import { lockPurchaseFor } from './lock-purchase';
import type { BillingDeps } from './billing-deps';

/**
 * Apply `event` inside the webhook's system transaction `t` and return a short word for the log
 * and the answer ('credited', 'already-completed', 'noted', 'ignored', ...).
 * @example await applyPaymentEvent(deps, t, event) // 'credited'
 */
export async function applyPaymentEvent(deps: BillingDeps, t: Transaction, event: Stripe.Event): Promise<string> {
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded': {
      const session = event.data.object;
      if (session.payment_status !== 'paid') return notePending(session.metadata?.purchaseId, session.id, {});
      return completePurchase(deps, t, session, event.id);
    }
    case 'checkout.session.async_payment_failed': {
      const session = event.data.object;
      return notePending(session.metadata?.purchaseId, session.id, { lastPaymentError: 'The payment did not go through.' });
    }
    case 'checkout.session.expired': {
      const session = event.data.object;
      return notePending(session.metadata?.purchaseId, session.id, { status: 'expired' });
    }
    case 'payment_intent.succeeded': {
      const intent = event.data.object;
      return notePending(intent.metadata?.purchaseId, null, { paymentIntentId: intent.id, lastPaymentError: null });
    }
    case 'payment_intent.payment_failed': {
      const intent = event.data.object;
      const message = intent.last_payment_error?.message ?? 'The payment did not go through.';
      return notePending(intent.metadata?.purchaseId, null, { paymentIntentId: intent.id, lastPaymentError: message.slice(0, 500) });
    }
    default:
      return 'ignored';
  }
}

/** Change a purchase only while it is pending: late or repeated events leave a finished one alone. */
async function notePending(purchaseId: string | undefined, sessionId: string | null, change: { status?: 'expired'; paymentIntentId?: string; lastPaymentError?: string | null }): Promise<string> {
  const purchase = await lockPurchaseFor(purchaseId, sessionId);
  if (!purchase) return 'unknown-purchase';
  if (purchase.status !== 'pending') return `already-${purchase.status}`;
  if (Object.keys(change).length > 0) await purchase.update(change);
  return 'noted';
}
