/**
 * Buying report credits end to end against the payment stand-in (fakes/payments, through its
 * fixture, on ephemeral ports): price list, offers, checkout through the official SDK, the hosted
 * payment page, signed webhook deliveries with replays and out-of-order arrival, receipts.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import Stripe from 'stripe';
import { buildLabScenario } from '../../test/support/factories';
import { payOnHostedPage } from '../../fakes/payments/hosted-page-client';
import { TEST_WEBHOOK_SECRET } from '../../fakes/payments/payments-fixture';
import { actingAs, eventually, ledgerOf, mailJobs, startBillingStack, type BillingStack } from './billing-stack.test-support';

jest.setTimeout(60_000);
let stack: BillingStack;
beforeAll(async () => {
  stack = await startBillingStack();
});
afterAll(() => stack?.close());

// Invented prices, as in the demo: 1 credit GBP 180, 5 for GBP 800, 20 for GBP 2,900 (minor units: pence).
const PRICE_LIST = { currency: 'GBP', packs: [{ credits: 20, priceMinor: 290_000 }, { credits: 1, priceMinor: 18_000 }, { credits: 5, priceMinor: 80_000 }], refundOnWithdrawWithinDays: 30 };

async function sellingLab() {
  const s = await buildLabScenario(stack.t.sequelize);
  const billing = await actingAs(stack.t, s.billing, s.lab.id);
  expect((await billing('put', '/billing/price-list', PRICE_LIST)).status).toBe(200);
  const maker = await actingAs(stack.t, s.makerAdmin, s.maker.id);
  return { s, billing, maker };
}

async function checkout(maker: Awaited<ReturnType<typeof actingAs>>, labId: string, packId = 'pack-5') {
  const res = await maker('post', '/billing/checkout', { labId, packId });
  expect(res.status).toBe(201);
  return res.body as { purchaseId: string; url: string };
}

/** The stand-in's events about one checkout session (its own and its payment intent's), oldest first. */
async function eventsOf(sessionId: string) {
  const session = await stack.payments.stripe.checkout.sessions.retrieve(sessionId);
  const all = await stack.payments.stripe.events.list({ limit: 100 });
  const about = (e: Stripe.Event) => {
    const o = e.data.object as { id?: string };
    return o.id === sessionId || (session.payment_intent !== null && o.id === session.payment_intent);
  };
  return all.data.filter(about).reverse();
}

const sessionIdOf = (url: string) => url.split('/pay/')[1];

/**
 * Pay with each card in turn while the webhook endpoint refuses deliveries, and wait until the
 * stand-in has tried (and failed) to deliver every resulting event, so none reaches the app by
 * itself afterwards (its next retry is a minute away): the test then hands them over by replay.
 */
async function payWhileGateClosed(url: string, cards: string[]): Promise<number[]> {
  stack.closeWebhookGate();
  try {
    const statuses = [];
    for (const number of cards) statuses.push((await payOnHostedPage(url, { number })).status);
    const events = await eventsOf(sessionIdOf(url));
    await eventually('the first delivery attempts were refused', async () => {
      const d = (await stack.control('GET', '/deliveries')) as { data: { eventId: string; attempts: unknown[] }[] };
      return events.every((e) => d.data.some((x) => x.eventId === e.id && x.attempts.length > 0)) ? true : undefined;
    });
    return statuses;
  } finally {
    stack.openWebhookGate();
  }
}
const replay = (eventId: string) => stack.control('POST', `/events/${eventId}/replay`) as Promise<{ deliveries: { attempts: { status: number | null }[] }[] }>;

describe('price list and offers', () => {
  it('stores packs sorted by size, shows them to client manufacturers only, and refuses two packs of one size', async () => {
    const { s, billing, maker } = await sellingLab();
    const list = (await billing('get', '/billing/price-list')).body;
    expect(list).toMatchObject({ configured: true, currency: 'GBP', refundOnWithdrawWithinDays: 30 });
    // 80 000 / 5 = 16 000 pence per credit; 290 000 / 20 = 14 500 (arithmetic).
    expect(list.packs).toEqual([
      { id: 'pack-1', credits: 1, priceMinor: 18_000, currency: 'GBP', pricePerCreditMinor: 18_000 },
      { id: 'pack-5', credits: 5, priceMinor: 80_000, currency: 'GBP', pricePerCreditMinor: 16_000 },
      { id: 'pack-20', credits: 20, priceMinor: 290_000, currency: 'GBP', pricePerCreditMinor: 14_500 },
    ]);
    const offers = (await maker('get', '/billing/offers')).body.items;
    expect(offers).toEqual([expect.objectContaining({ lab: { id: s.lab.id, name: s.lab.name }, clientId: s.client.id, balance: 0, currency: 'GBP', packs: list.packs })]);

    const dup = await billing('put', '/billing/price-list', { currency: 'EUR', packs: [{ credits: 5, priceMinor: 1 }, { credits: 5, priceMinor: 2 }] });
    expect(dup.status).toBe(422);
    expect(dup.body.errors[0].pointer).toBe('/packs/1/credits');
    for (const bad of [{ currency: 'XXX', packs: [{ credits: 1, priceMinor: 1 }] }, { currency: 'GBP', packs: [] }, { currency: 'GBP', packs: [{ credits: 1, priceMinor: 100_000_000 }] }, { currency: 'GBP', packs: [{ credits: 1, priceMinor: 1.5 }] }]) {
      expect((await billing('put', '/billing/price-list', bad)).status).toBe(422);
    }
    expect((await billing('get', '/billing/price-list')).body.currency).toBe('GBP');

    const stranger = await buildLabScenario(stack.t.sequelize);
    const other = await actingAs(stack.t, stranger.makerAdmin, stranger.maker.id);
    expect((await other('get', '/billing/offers')).body.items.map((o: { lab: { id: string } }) => o.lab.id)).not.toContain(s.lab.id);
    expect((await other('post', '/billing/checkout', { labId: s.lab.id, packId: 'pack-5' })).status).toBe(404);
    expect((await maker('post', '/billing/checkout', { labId: s.lab.id, packId: 'pack-7' })).status).toBe(422);
  });
});

describe('paying for a pack', () => {
  it('credits the pack once after the card is paid, with a receipt PDF and its e-mail', async () => {
    const { s, billing, maker } = await sellingLab();
    const { purchaseId, url } = await checkout(maker, s.lab.id);
    const session = await stack.payments.stripe.checkout.sessions.retrieve(sessionIdOf(url));
    expect(session).toMatchObject({ amount_total: 80_000, currency: 'gbp', metadata: { purchaseId, labId: s.lab.id, clientId: s.client.id, packId: 'pack-5', credits: '5' } });
    expect(session.success_url).toBe(`http://127.0.0.1:4610/billing?checkout=success&purchase=${purchaseId}`);
    expect(session.cancel_url).toBe(`http://127.0.0.1:4610/billing?checkout=cancelled&purchase=${purchaseId}`);
    expect((await maker('get', `/billing/purchases/${purchaseId}`)).body).toMatchObject({ status: 'pending', message: expect.stringMatching(/No credits have been added yet/) });

    const paid = await payOnHostedPage(url, { number: '4242 4242 4242 4242' });
    expect(paid.status).toBe(303);
    expect(paid.location).toBe(session.success_url);
    const done = await eventually('the purchase completes', async () => {
      const p = (await maker('get', `/billing/purchases/${purchaseId}`)).body;
      return p.status === 'completed' ? p : undefined;
    });
    expect(done).toMatchObject({ credits: 5, amountText: 'GBP 800.00', message: `Paid: 5 report credits added to your balance with ${s.lab.name}.` });
    expect(done.receiptNumber).toMatch(new RegExp(`^${s.lab.code}-R\\d{4}-0001$`));
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).balance).toBe(5);
    expect((await maker('get', '/billing/balance')).body).toMatchObject({ items: [{ lab: { id: s.lab.id }, balance: 5 }], totalCredits: 5 });

    // Both sides list it; the lab's overview counts it.
    expect((await billing('get', '/billing/purchases')).body).toMatchObject({ total: 1, items: [{ id: purchaseId, status: 'completed' }] });
    const sales = (await billing('get', '/billing/sales')).body;
    expect(sales.totals).toEqual([{ currency: 'GBP', completedPurchases: 1, revenueMinor: 80_000, creditsSold: 5, pendingPurchases: 0 }]);
    expect(sales.clients.items).toEqual([expect.objectContaining({ clientId: s.client.id, balance: 5, purchased: 5 })]);

    // The receipt, read back with pdftotext (poppler).
    const pdf = await maker('get', `/billing/purchases/${purchaseId}/receipt`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-receipt-')), 'receipt.pdf');
    fs.writeFileSync(file, pdf.body as Buffer);
    const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    for (const part of [done.receiptNumber, s.lab.name, s.client.name, 'Total paid: GBP 800.00', 'Report credits, pack of 5']) expect(text).toContain(part);

    expect((await billing('get', `/billing/purchases/${purchaseId}/receipt`)).status).toBe(200);
    const elsewhere = await buildLabScenario(stack.t.sequelize);
    const otherLab = await actingAs(stack.t, elsewhere.billing, elsewhere.lab.id);
    expect((await otherLab('get', `/billing/purchases/${purchaseId}`)).status).toBe(404);
    expect((await otherLab('get', `/billing/purchases/${purchaseId}/receipt`)).status).toBe(404);
    expect((await otherLab('get', '/billing/purchases')).body.total).toBe(0);

    // A second checkout reuses the provider customer; lists page, filter and sort on the server.
    const again = await checkout(maker, s.lab.id, 'pack-1');
    expect((await stack.payments.stripe.checkout.sessions.retrieve(sessionIdOf(again.url))).customer).toBe(session.customer);
    expect((await stack.payments.stripe.customers.list({ limit: 100 })).data.filter((c) => c.metadata.organizationId === s.maker.id)).toHaveLength(1);
    const firstPage = (await maker('get', '/billing/purchases?pageSize=1&sort=-amountMinor')).body;
    expect(firstPage).toMatchObject({ total: 2, page: 1, pageSize: 1, items: [{ id: purchaseId }] });
    expect((await maker('get', '/billing/purchases?status=pending')).body.items.map((p: { id: string }) => p.id)).toEqual([again.purchaseId]);
    expect((await maker('get', '/billing/purchases?sort=secret')).status).toBe(400);
    expect((await maker('get', '/billing/purchases?status=paid')).status).toBe(400);

    const [mail] = await mailJobs(stack.t, done.receiptNumber);
    expect(mail.data.to).toBe(s.makerAdmin.email);
    expect(mail.data.attachments?.[0].filename).toBe(`${done.receiptNumber}.pdf`);
    expect(Buffer.from(mail.data.attachments![0].contentBase64, 'base64').equals(pdf.body as Buffer)).toBe(true);
  });

  it('credits once when the stand-in delivers the completed event ten times', async () => {
    const { s, maker } = await sellingLab();
    const { purchaseId, url } = await checkout(maker, s.lab.id, 'pack-20');
    await payOnHostedPage(url, { number: '4242424242424242' });
    await eventually('credited', async () => ((await ledgerOf(stack.t, s.lab.id, s.client.id)).balance === 20 ? true : undefined));
    const completed = (await eventsOf(sessionIdOf(url))).find((e) => e.type === 'checkout.session.completed')!;
    for (let i = 0; i < 10; i++) {
      const { deliveries } = await replay(completed.id);
      expect(deliveries[0].attempts.at(-1)!.status).toBe(200); // every redelivery is acknowledged
    }
    const deliveries = (await stack.control('GET', `/deliveries?event=${completed.id}`)) as { data: { attempts: unknown[] }[] };
    expect(deliveries.data[0].attempts).toHaveLength(11);
    const ledger = await ledgerOf(stack.t, s.lab.id, s.client.id);
    expect(ledger.rows).toEqual([{ kind: 'purchase', credits: 20, report_id: null, provider_event_id: completed.id }]);
    expect((await maker('get', `/billing/purchases/${purchaseId}`)).body.status).toBe('completed');
  });

  it('handles events out of order: the session before its payment, a decline after the success, repeats at the end', async () => {
    const { s, maker } = await sellingLab();
    const { purchaseId, url } = await checkout(maker, s.lab.id, 'pack-1');
    // A declined attempt, then a successful one, on the same payment page; the app hears nothing yet.
    const statuses = await payWhileGateClosed(url, ['4000 0000 0000 0002', '4242 4242 4242 4242']);
    expect(statuses).toEqual([402, 303]);
    expect((await eventsOf(sessionIdOf(url))).map((e) => e.type)).toEqual(expect.arrayContaining(['payment_intent.payment_failed', 'payment_intent.succeeded', 'checkout.session.completed']));
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).rows).toEqual([]);
    const byType = (type: string) => (async () => (await eventsOf(sessionIdOf(url))).find((e) => e.type === type)!)();
    await replay((await byType('checkout.session.completed')).id);
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).balance).toBe(1);
    await replay((await byType('payment_intent.payment_failed')).id);
    await replay((await byType('payment_intent.succeeded')).id);
    await stack.control('POST', '/deliver-pending');
    const after = (await maker('get', `/billing/purchases/${purchaseId}`)).body;
    expect(after).toMatchObject({ status: 'completed', message: expect.stringMatching(/^Paid: 1 report credit added/) });
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).rows.map((r) => [r.kind, r.credits])).toEqual([['purchase', 1]]);
  });

  it('a declined card adds no credits, and the buyer is told why on return', async () => {
    const { s, maker } = await sellingLab();
    const { purchaseId, url } = await checkout(maker, s.lab.id);
    const declined = await payOnHostedPage(url, { number: '4000000000000002' });
    expect(declined.status).toBe(402);
    expect(declined.html).toContain('Your card was declined.');
    const p = await eventually('the decline is noted', async () => {
      const body = (await maker('get', `/billing/purchases/${purchaseId}`)).body;
      return body.message.includes('declined') ? body : undefined;
    });
    expect(p).toMatchObject({ status: 'pending', receiptNumber: null });
    expect(p.message).toBe('The payment did not go through: Your card was declined. No credits were added; you can try again with another card.');
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).rows).toEqual([]);
    expect((await maker('get', `/billing/purchases/${purchaseId}/receipt`)).status).toBe(404);
  });

  it('refuses a webhook with a bad, missing or foreign signature with 400 and changes nothing', async () => {
    const { s, maker } = await sellingLab();
    const { url } = await checkout(maker, s.lab.id);
    await payWhileGateClosed(url, ['4242 4242 4242 4242']);
    const completed = (await eventsOf(sessionIdOf(url))).find((e) => e.type === 'checkout.session.completed')!;
    const payload = JSON.stringify(completed);
    const post = (body: string, signature?: string) => {
      const r = request(stack.t.app).post('/api/billing/webhook').set('Content-Type', 'application/json');
      return (signature ? r.set('Stripe-Signature', signature) : r).send(body);
    };
    // Headers made by the SDK's own test helper: HMAC-SHA256 over "<t>.<payload>".
    const sign = (body: string, secret: string) => stack.payments.stripe.webhooks.generateTestHeaderString({ payload: body, secret });
    expect((await post(payload)).status).toBe(400);
    expect((await post(payload, sign(payload, 'whsec_someone_else'))).status).toBe(400);
    const tampered = payload.replace(/"amount_total":\s*80000/, '"amount_total":1');
    expect(tampered).not.toBe(payload);
    expect((await post(tampered, sign(payload, TEST_WEBHOOK_SECRET))).status).toBe(400);
    const stale = stack.payments.stripe.webhooks.generateTestHeaderString({ payload, secret: TEST_WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 3600 });
    expect((await post(payload, stale)).status).toBe(400);
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).rows).toEqual([]);
    // The same bytes with the right signature are accepted.
    const ok = await post(payload, sign(payload, TEST_WEBHOOK_SECRET));
    expect(ok.status).toBe(200);
    expect(ok.body).toEqual({ received: true, eventId: completed.id, outcome: 'credited' });
    expect((await ledgerOf(stack.t, s.lab.id, s.client.id)).balance).toBe(5);
  });
});
