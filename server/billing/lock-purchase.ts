/**
 * Find and lock (FOR UPDATE) the purchase a provider event is about, by our purchase id in its
 * metadata or by the checkout session id. Events about one purchase are thereby handled one at a
 * time, whatever order and however often they arrive.
 */
import type Stripe from 'stripe';
import { Client, CreditPurchase } from '../db/models';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The locked purchase, or null. When none is stored but `session` carries our complete
 * metadata (the request that created the session failed after the provider answered), the
 * pending purchase is recreated from it, provided the client really is that lab's client of
 * that buyer. Call inside the webhook's system transaction.
 */
export async function lockPurchaseFor(purchaseId: string | undefined, sessionId: string | null, session?: Stripe.Checkout.Session): Promise<CreditPurchase | null> {
  if (purchaseId && UUID.test(purchaseId)) {
    const byId = await CreditPurchase.findByPk(purchaseId, { lock: true });
    if (byId) return byId;
  }
  if (sessionId) {
    const bySession = await CreditPurchase.findOne({ where: { checkoutSessionId: sessionId }, lock: true });
    if (bySession) return bySession;
  }
  return session ? recoverPurchase(session) : null;
}

async function recoverPurchase(session: Stripe.Checkout.Session): Promise<CreditPurchase | null> {
  const m = session.metadata ?? {};
  const credits = Number(m.credits);
  const ids = [m.purchaseId, m.labId, m.clientId, m.buyerOrganizationId];
  if (!ids.every((id) => typeof id === 'string' && UUID.test(id)) || !Number.isInteger(credits) || credits < 1 || !m.packId) return null;
  const client = await Client.findOne({ where: { id: m.clientId, organizationId: m.labId } });
  if (!client || client.clientOrganizationId !== m.buyerOrganizationId || !session.amount_total || !session.currency) return null;
  await CreditPurchase.create({
    id: m.purchaseId,
    organizationId: m.labId,
    clientId: m.clientId,
    buyerOrganizationId: m.buyerOrganizationId,
    boughtBy: null,
    packId: m.packId.slice(0, 40),
    credits,
    amountMinor: session.amount_total,
    currency: session.currency.toUpperCase(),
    status: 'pending',
    checkoutSessionId: session.id,
    paymentIntentId: null,
    lastPaymentError: null,
    completedAt: null,
  });
  return CreditPurchase.findByPk(m.purchaseId, { lock: true });
}
