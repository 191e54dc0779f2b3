import Stripe from 'stripe';
import { startPaymentsFixture, TEST_SECRET_KEY, type PaymentsFixture } from './payments-fixture';

// Idempotency rules as documented for the payment API (from memory): a key replays the first
// result for the same parameters, and is an error with different ones.
describe('idempotent requests', () => {
  let fixture: PaymentsFixture;
  beforeEach(async () => (fixture = await startPaymentsFixture()));
  afterEach(() => fixture.close());

  it('replays the first response for the same key and parameters, creating one object', async () => {
    const first = await fixture.stripe.customers.create(
      { email: 'once@lab.test' },
      { idempotencyKey: 'order-42-customer' },
    );
    const again = await fixture.stripe.customers.create(
      { email: 'once@lab.test' },
      { idempotencyKey: 'order-42-customer' },
    );
    expect(again.id).toBe(first.id);
    expect(again.lastResponse.headers['idempotent-replayed']).toBe('true');
    expect((await fixture.stripe.customers.list()).data).toHaveLength(1);
    expect((await fixture.stripe.events.list({ type: 'customer.created' })).data).toHaveLength(1);
  });

  it('rejects the same key with different parameters → StripeIdempotencyError (400)', async () => {
    await fixture.stripe.customers.create(
      { email: 'a@lab.test' },
      { idempotencyKey: 'reused-key' },
    );
    const attempt = fixture.stripe.customers.create(
      { email: 'b@lab.test' },
      { idempotencyKey: 'reused-key' },
    );
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
    await expect(attempt).rejects.toMatchObject({ statusCode: 400, rawType: 'idempotency_error' });
  });

  it('treats parameter order as irrelevant and another path as different', async () => {
    const post = (path: string, body: string) =>
      fetch(`http://127.0.0.1:${fixture.standIn.port}${path}`, {
        method: 'POST',
        headers: {
          Authorization: `Bearer ${TEST_SECRET_KEY}`,
          'Idempotency-Key': 'raw-key',
          'Content-Type': 'application/x-www-form-urlencoded',
        },
        body,
      });
    const first = (await (await post('/v1/customers', 'name=A&email=a%40lab.test')).json()) as {
      id: string;
    };
    const reordered = await post('/v1/customers', 'email=a%40lab.test&name=A');
    expect(((await reordered.json()) as { id: string }).id).toBe(first.id);
    expect((await post(`/v1/customers/${first.id}`, 'name=A&email=a%40lab.test')).status).toBe(400);
  });

  it('replays a card decline (402) instead of charging again, and survives a restart', async () => {
    const params = {
      amount: 900,
      currency: 'eur',
      payment_method: 'pm_card_chargeDeclined',
      confirm: true,
    };
    const fail = (await fixture.stripe.paymentIntents
      .create(params, { idempotencyKey: 'charge-1' })
      .catch((error: unknown) => error)) as Stripe.errors.StripeCardError;
    expect(fail).toBeInstanceOf(Stripe.errors.StripeCardError);
    await fixture.restart();
    const replayed = (await fixture.stripe.paymentIntents
      .create(params, { idempotencyKey: 'charge-1' })
      .catch((error: unknown) => error)) as Stripe.errors.StripeCardError;
    expect(replayed).toBeInstanceOf(Stripe.errors.StripeCardError);
    expect(replayed.payment_intent?.id).toBe(fail.payment_intent?.id);
    expect((await fixture.stripe.paymentIntents.list()).data).toHaveLength(1);
  });

  it('does not save validation failures: the key can be used again after fixing the request', async () => {
    await expect(
      fixture.stripe.customers.create({ email: 'bad' }, { idempotencyKey: 'fix-me' }),
    ).rejects.toMatchObject({
      statusCode: 400,
    });
    const fixed = await fixture.stripe.customers.create(
      { email: 'good@lab.test' },
      { idempotencyKey: 'fix-me' },
    );
    expect(fixed.email).toBe('good@lab.test');
  });
});
