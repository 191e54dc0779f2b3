/**
 * A manufacturer buys a pack of report credits from a lab it is a client of: a checkout session
 * at the payment provider (metadata names lab, client, pack and credits; the return URLs lead
 * back into the app) and a pending purchase row. Credits are added only by the provider's signed
 * webhook (apply-payment-event.ts), never by the browser coming back.
 */
import crypto from 'node:crypto';
import { Client, CreditPurchase, Organization } from '../db/models';
import { conflict, notFound, serviceUnavailable, validationFailed } from '../http/problem';
import { audit } from '../audit/audit';
import { findPriceList } from './price-list';
import { ensurePaymentCustomer } from './ensure-payment-customer';
import { paymentServiceProblem } from './payment-service-problem';
import type { BillingActor, BillingDeps } from './billing-deps';
import type { CheckoutBody } from '../../shared/schemas/billing';

/** The lab's client record for the active manufacturer (the oldest, when the lab keeps several). */
export async function linkedClientAt(labId: string, manufacturerId: string): Promise<Client | null> {
  return Client.findOne({ where: { organizationId: labId, clientOrganizationId: manufacturerId }, order: [['createdAt', 'ASC'], ['id', 'ASC']] });
}

/**
 * Start the checkout of `body.packId` at `body.labId` for the active manufacturer. 404 when the
 * manufacturer is not a client of that lab; 409 `no-price-list` when the lab sells no credits;
 * 422 for a pack not on its list; 503 when the provider cannot be reached (nothing is stored).
 * @example await startCheckout(deps, ctx, { labId, packId: 'pack-5' }) // { purchaseId, url: 'http://127.0.0.1:4627/pay/cs_...' }
 */
export async function startCheckout(deps: BillingDeps, ctx: BillingActor, body: CheckoutBody): Promise<{ purchaseId: string; url: string }> {
  const buyerId = ctx.organizationId!;
  const lab = await Organization.findByPk(body.labId);
  const client = lab?.kind === 'lab' ? await linkedClientAt(lab.id, buyerId) : null;
  if (!lab || !client) throw notFound('The lab');
  const priceList = await findPriceList(lab.id);
  if (!priceList) throw conflict(`${lab.name} does not sell report credits online yet.`, { code: 'no-price-list' });
  const pack = priceList.packs.find((p) => p.id === body.packId);
  if (!pack) throw validationFailed(`${lab.name} has no pack "${body.packId}".`, [{ pointer: '/packId', message: 'is not on the lab’s price list' }]);
  const purchaseId = crypto.randomUUID();
  const back = (outcome: 'success' | 'cancelled') => `${deps.publicUrl}/billing?checkout=${outcome}&purchase=${purchaseId}`;
  const metadata = { purchaseId, labId: lab.id, clientId: client.id, buyerOrganizationId: buyerId, packId: pack.id, credits: String(pack.credits) };
  const description = `${pack.credits} report credit${pack.credits === 1 ? '' : 's'} with ${lab.name}`;
  let session;
  try {
    const customer = await ensurePaymentCustomer(deps.payments, deps.sequelize, ctx);
    session = await deps.payments.checkout.sessions.create(
      {
        mode: 'payment',
        customer,
        line_items: [{ price_data: { currency: priceList.currency.toLowerCase(), unit_amount: pack.priceMinor, product_data: { name: description } }, quantity: 1 }],
        success_url: back('success'),
        cancel_url: back('cancelled'),
        client_reference_id: purchaseId,
        metadata,
        payment_intent_data: { description, metadata },
      },
      { idempotencyKey: `sidecheck-checkout-${purchaseId}` },
    );
  } catch (error) {
    throw paymentServiceProblem(error) ?? error;
  }
  // An open session always has a url; without one there is no page to send the buyer to.
  if (!session.url) throw serviceUnavailable('The payment page could not be opened, and nothing was charged. Try again in a minute.');
  const purchase = await CreditPurchase.create({
    id: purchaseId,
    organizationId: lab.id,
    clientId: client.id,
    buyerOrganizationId: buyerId,
    boughtBy: ctx.principal?.userId ?? null,
    packId: pack.id,
    credits: pack.credits,
    amountMinor: pack.priceMinor,
    currency: priceList.currency,
    status: 'pending',
    checkoutSessionId: session.id,
    paymentIntentId: null,
    lastPaymentError: null,
    completedAt: null,
  });
  await audit(ctx, { action: 'credit-checkout', entity: 'credit-purchase', entityId: purchase.id, after: { ...metadata, amountMinor: pack.priceMinor, currency: priceList.currency, checkoutSessionId: session.id } });
  return { purchaseId, url: session.url };
}
