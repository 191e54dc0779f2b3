import Stripe from 'stripe';
import {
  buildCheckoutSessionParams,
  startPaymentsFixture,
  TEST_SECRET_KEY,
  TEST_WEBHOOK_SECRET,
  type PaymentsFixture,
} from './payments-fixture';
import type { WebhookDelivery } from './payments-state';
import { payOnHostedPage } from './hosted-page-client';
import { startWebhookReceiver, type WebhookReceiver } from './webhook-receiver-fixture';

// The SDK's webhooks.constructEvent is the independent reference for the signature scheme.
const verifier = new Stripe(TEST_SECRET_KEY, { telemetry: false });

describe('webhook delivery', () => {
  let receiver: WebhookReceiver;
  let fixture: PaymentsFixture;
  const control = (path: string, method = 'POST') =>
    fetch(`${fixture.baseUrl}/_control${path}`, {
      method,
      headers: { Authorization: `Bearer ${TEST_SECRET_KEY}` },
    });

  afterEach(async () => {
    await fixture.close();
    await receiver.close();
  });

  it('signs each delivery so constructEvent accepts it and rejects a tampered body', async () => {
    receiver = await startWebhookReceiver([200]);
    fixture = await startPaymentsFixture({
      webhookUrl: receiver.url,
      webhookSecret: TEST_WEBHOOK_SECRET,
    });
    const customer = await fixture.stripe.customers.create({ email: 'hook@lab.test' });
    const [delivery] = await receiver.waitFor(1);

    expect(delivery.contentType).toContain('application/json');
    const event = verifier.webhooks.constructEvent(
      delivery.body,
      delivery.signature,
      TEST_WEBHOOK_SECRET,
    );
    expect(event).toMatchObject({
      object: 'event',
      type: 'customer.created',
      livemode: false,
      api_version: Stripe.API_VERSION,
      data: { object: { id: customer.id, email: 'hook@lab.test' } },
    });
    expect(event.id).toMatch(/^evt_/);
    expect(event).toHaveProperty('pending_webhooks');
    expect(await fixture.stripe.events.retrieve(event.id)).toMatchObject({
      id: event.id,
      pending_webhooks: 0,
    });

    const tampered = delivery.body.replace('hook@lab.test', 'evil@lab.test');
    expect(() =>
      verifier.webhooks.constructEvent(tampered, delivery.signature, TEST_WEBHOOK_SECRET),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
    expect(() =>
      verifier.webhooks.constructEvent(delivery.body, delivery.signature, 'whsec_other'),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);
  });

  it('delivers the payment events of a paid checkout in order', async () => {
    receiver = await startWebhookReceiver([200]);
    fixture = await startPaymentsFixture({
      webhookUrl: receiver.url,
      webhookSecret: TEST_WEBHOOK_SECRET,
    });
    const session = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer_email: 'a@lab.test' }),
    );
    await payOnHostedPage(session.url ?? '', { number: '4242424242424242' });
    const deliveries = await receiver.waitFor(4);
    const types = deliveries.map(
      (d) => verifier.webhooks.constructEvent(d.body, d.signature, TEST_WEBHOOK_SECRET).type,
    );
    expect(types).toEqual([
      'payment_intent.created',
      'charge.succeeded',
      'payment_intent.succeeded',
      'checkout.session.completed',
    ]);
    const completed = JSON.parse(deliveries[3].body) as Stripe.Event;
    expect(completed.data.object).toMatchObject({
      id: session.id,
      status: 'complete',
      payment_status: 'paid',
    });
  });

  it('retries with doubling delays until the receiver answers 2xx, and keeps every attempt', async () => {
    receiver = await startWebhookReceiver([500, 503, 200]);
    const retryBaseMs = 80;
    fixture = await startPaymentsFixture({
      webhookUrl: receiver.url,
      webhookSecret: TEST_WEBHOOK_SECRET,
      retryBaseMs,
    });
    await fixture.stripe.customers.create({});
    const arrivals = (await receiver.waitFor(3, 5000)).map((d) => d.receivedAtMs);
    // Delay after failure n is base · 2^(n−1): ≥ 80 ms, then ≥ 160 ms (timer jitter only adds).
    expect(arrivals[1] - arrivals[0]).toBeGreaterThanOrEqual(retryBaseMs - 5);
    expect(arrivals[2] - arrivals[1]).toBeGreaterThanOrEqual(2 * retryBaseMs - 5);

    await new Promise((resolve) => setTimeout(resolve, 50));
    const list = (await (await control('/deliveries', 'GET')).json()) as {
      data: WebhookDelivery[];
    };
    expect(list.data).toHaveLength(1);
    expect(list.data[0].attempts.map((attempt) => attempt.status)).toEqual([500, 503, 200]);
    expect(list.data[0].deliveredAt).not.toBeNull();
    // Verifying each retry's signature: every attempt is signed afresh with its own timestamp.
    for (const delivery of receiver.received) {
      expect(() =>
        verifier.webhooks.constructEvent(delivery.body, delivery.signature, TEST_WEBHOOK_SECRET),
      ).not.toThrow();
    }
  });

  it('replays an event and delivers pending ones on request (test controls)', async () => {
    receiver = await startWebhookReceiver([500, 200]);
    fixture = await startPaymentsFixture({
      webhookUrl: receiver.url,
      webhookSecret: TEST_WEBHOOK_SECRET,
      retryBaseMs: 60_000,
    });
    await fixture.stripe.customers.create({});
    await receiver.waitFor(1);
    const pending = (await (await control('/deliver-pending')).json()) as {
      attempted: number;
      delivered: number;
    };
    expect(pending).toEqual({ attempted: 1, delivered: 1 });

    const [event] = (await fixture.stripe.events.list()).data;
    const replay = await control(`/events/${event.id}/replay`);
    expect(replay.status).toBe(200);
    expect(receiver.received).toHaveLength(3);
    expect(JSON.parse(receiver.received[2].body).id).toBe(event.id);
    expect((await control('/events/evt_unknown/replay')).status).toBe(404);
  });

  it('resumes pending deliveries after a restart', async () => {
    receiver = await startWebhookReceiver([503, 200]);
    const retryBaseMs = 300;
    fixture = await startPaymentsFixture({
      webhookUrl: receiver.url,
      webhookSecret: TEST_WEBHOOK_SECRET,
      retryBaseMs,
    });
    await fixture.stripe.customers.create({});
    const attempts = async () =>
      ((await (await control('/deliveries', 'GET')).json()) as { data: WebhookDelivery[] }).data[0]
        .attempts.length;
    while ((await attempts()) < 1) await new Promise((resolve) => setTimeout(resolve, 10));
    await fixture.standIn.close(); // stopped before the retry was due
    await new Promise((resolve) => setTimeout(resolve, retryBaseMs + 50));
    expect(receiver.received).toHaveLength(1);

    await fixture.restart(); // same data folder: the overdue retry runs on start
    await receiver.waitFor(2);
    await new Promise((resolve) => setTimeout(resolve, 50));
    const [delivery] = (
      (await (await control('/deliveries', 'GET')).json()) as { data: WebhookDelivery[] }
    ).data;
    expect(delivery.attempts.map((attempt) => attempt.status)).toEqual([503, 200]);
    expect(delivery.deliveredAt).not.toBeNull();
  });

  it('refuses a webhook URL without a signing secret', async () => {
    receiver = await startWebhookReceiver();
    await expect(startPaymentsFixture({ webhookUrl: receiver.url })).rejects.toThrow(TypeError);
    fixture = await startPaymentsFixture();
  });
});
