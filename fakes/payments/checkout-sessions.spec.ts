import Stripe from 'stripe';
import {
  buildCheckoutSessionParams,
  startPaymentsFixture,
  type PaymentsFixture,
} from './payments-fixture';

// Checkout Session behaviour as in the public API reference (from memory), through the SDK.
describe('checkout sessions through the SDK', () => {
  let fixture: PaymentsFixture;
  beforeEach(async () => (fixture = await startPaymentsFixture()));
  afterEach(() => fixture.close());

  it('creates an open, unpaid session for a customer with totals and a hosted URL', async () => {
    const customer = await fixture.stripe.customers.create({ email: 'billing@lab.test' });
    const session = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer: customer.id }),
    );
    expect(session.id).toMatch(/^cs_test_/);
    // 4900 × 1 + 1250 × 2, summed independently of the stand-in.
    expect(session).toMatchObject({
      object: 'checkout.session',
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      amount_subtotal: 7400,
      amount_total: 7400,
      currency: 'eur',
      customer: customer.id,
      customer_email: null,
      client_reference_id: 'order-42',
      metadata: { tenant: 'lab-42' },
      payment_intent: null,
      livemode: false,
    });
    expect(session.url).toBe(`${fixture.baseUrl}/pay/${session.id}`);
    // Default expiry: 24 h after creation.
    expect(session.expires_at - session.created).toBe(24 * 3600);
  });

  it('serves line items only on expansion or from the line_items endpoint', async () => {
    const session = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer_email: 'a@lab.test' }),
    );
    expect(session.line_items).toBeUndefined();
    const expanded = await fixture.stripe.checkout.sessions.retrieve(session.id, {
      expand: ['line_items'],
    });
    expect(
      expanded.line_items?.data.map((item) => [item.description, item.quantity, item.amount_total]),
    ).toEqual([
      ['Sidecheck Lab, 1 month', 1, 4900],
      ['Signed report credits', 2, 2500],
    ]);
    const items = await fixture.stripe.checkout.sessions.listLineItems(session.id, {
      expand: ['data.price.product'],
    });
    const product = items.data[1].price?.product as Stripe.Product;
    expect(product).toMatchObject({ object: 'product', name: 'Signed report credits' });
  });

  it('expires an open session once, with a checkout.session.expired event', async () => {
    const session = await fixture.stripe.checkout.sessions.create(buildCheckoutSessionParams());
    const expired = await fixture.stripe.checkout.sessions.expire(session.id);
    expect(expired).toMatchObject({ status: 'expired', url: null });
    await expect(fixture.stripe.checkout.sessions.expire(session.id)).rejects.toMatchObject({
      statusCode: 400,
    });
    const events = await fixture.stripe.events.list({ type: 'checkout.session.expired' });
    expect(events.data.map((event) => (event.data.object as Stripe.Checkout.Session).id)).toEqual([
      session.id,
    ]);
    expect((await fetch(session.url ?? '')).status).toBe(410);
  });

  it('lists sessions newest first with status and customer filters', async () => {
    const customer = await fixture.stripe.customers.create({});
    const first = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer: customer.id }),
    );
    const second = await fixture.stripe.checkout.sessions.create(buildCheckoutSessionParams());
    await fixture.stripe.checkout.sessions.expire(second.id);
    expect((await fixture.stripe.checkout.sessions.list()).data.map((s) => s.id)).toEqual([
      second.id,
      first.id,
    ]);
    expect(
      (await fixture.stripe.checkout.sessions.list({ status: 'open' })).data.map((s) => s.id),
    ).toEqual([first.id]);
    expect(
      (await fixture.stripe.checkout.sessions.list({ customer: customer.id })).data,
    ).toHaveLength(1);
  });

  it('rejects invalid parameters with 400 and the parameter name', async () => {
    const reject = (overrides: Partial<Stripe.Checkout.SessionCreateParams>, param: string) =>
      expect(
        fixture.stripe.checkout.sessions.create(buildCheckoutSessionParams(overrides)),
      ).rejects.toMatchObject({
        type: 'StripeInvalidRequestError',
        statusCode: 400,
        param,
      });
    await reject({ customer: 'cus_missing' }, 'customer');
    const customer = await fixture.stripe.customers.create({});
    await reject({ customer: customer.id, customer_email: 'x@lab.test' }, 'customer_email');
    await reject({ line_items: [] }, 'line_items');
    await reject(
      {
        line_items: [{ price_data: { currency: 'eur', product_data: { name: 'x' } }, quantity: 1 }],
      },
      'line_items[0][price_data][unit_amount]',
    );
    await reject(
      {
        line_items: [
          { price_data: { currency: 'eur', unit_amount: 100, product_data: { name: 'x' } } },
        ],
      },
      'line_items[0][quantity]',
    );
    await reject({ success_url: 'not a url' }, 'success_url');
    await reject({ mode: 'subscription' }, 'mode');
    await reject({ expires_at: Math.floor(Date.now() / 1000) + 60 }, 'expires_at');
  });
});
