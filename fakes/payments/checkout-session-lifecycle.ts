import type { CheckoutSession } from './checkout-objects';
import { recordEvent } from './event-log';
import { unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';

/**
 * Moves an open session to 'expired' and records checkout.session.expired. The hosted URL stops
 * working: `url` becomes null, as the API only shows it while the session is open (from memory).
 * Call inside `store.mutate`.
 *
 * @param context - the stand-in context.
 * @param session - a stored session with status 'open'.
 * @throws TypeError when the session is not open.
 * @example expireSession(context, session); session.status === 'expired'
 */
export function expireSession(context: PaymentsContext, session: CheckoutSession): void {
  if (session.status !== 'open')
    throw new TypeError(`expireSession: ${session.id} is ${session.status}`);
  session.status = 'expired';
  session.url = null;
  recordEvent(context, 'checkout.session.expired', session);
}

/**
 * Expires every open session whose `expires_at` has passed (run on access and by a timer, so
 * checkout.session.expired is sent without anyone looking).
 *
 * @param context - the stand-in context.
 * @returns how many sessions expired.
 * @example expireDueSessions(context) // 0
 */
export function expireDueSessions(context: PaymentsContext): number {
  const now = unixNow();
  const due = Object.values(context.store.state.checkoutSessions).filter(
    (session) => session.status === 'open' && session.expires_at <= now,
  );
  if (due.length)
    context.store.mutate(() => due.forEach((session) => expireSession(context, session)));
  return due.length;
}

/**
 * Marks a paid session 'complete' / 'paid' with the buyer's details and records
 * checkout.session.completed. Call inside `store.mutate`, after the payment succeeded.
 *
 * @param context - the stand-in context.
 * @param session - the open session that was paid.
 * @param buyer - e-mail and cardholder name as entered.
 * @example completeSession(context, session, { email: 'a@b.test', name: 'A' })
 */
export function completeSession(
  context: PaymentsContext,
  session: CheckoutSession,
  buyer: { email: string | null; name: string | null },
): void {
  session.status = 'complete';
  session.payment_status = 'paid';
  session.url = null;
  session.customer_details = {
    address: null,
    email: buyer.email,
    name: buyer.name,
    phone: null,
    tax_exempt: 'none',
    tax_ids: [],
  };
  recordEvent(context, 'checkout.session.completed', session);
}

/**
 * The e-mail Checkout already knows for a session (customer_email, or the customer's), null
 * when the hosted page has to ask for it.
 */
export function knownBuyerEmail(context: PaymentsContext, session: CheckoutSession): string | null {
  if (session.customer_email) return session.customer_email;
  return session.customer ? (context.store.state.customers[session.customer]?.email ?? null) : null;
}
