import type Stripe from 'stripe';
import { payOnHostedPage } from './hosted-page-client';
import {
  buildCheckoutSessionParams,
  startPaymentsFixture,
  type PaymentsFixture,
} from './payments-fixture';

// Test card numbers and their results as published in the payment provider's testing docs
// (from memory): 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined (generic_decline).
const SUCCESS_CARD = '4242 4242 4242 4242';
const DECLINED_CARD = '4000 0000 0000 0002';

describe('hosted payment page driven with plain HTTP', () => {
  let fixture: PaymentsFixture;
  let session: Stripe.Checkout.Session;

  beforeEach(async () => {
    fixture = await startPaymentsFixture();
    const customer = await fixture.stripe.customers.create({
      email: 'billing@lab.test',
      name: 'Lab',
    });
    session = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({
        customer: customer.id,
        payment_intent_data: { metadata: { order: '42' } },
      }),
    );
  });
  afterEach(() => fixture.close());

  it('shows the items, the total and a card form without script, under a strict CSP', async () => {
    const response = await fetch(session.url ?? '');
    const html = await response.text();
    expect(response.status).toBe(200);
    expect(html).toContain('Sidecheck Lab, 1 month');
    expect(html).toContain('€74.00'); // 7400 euro cents
    expect(html).toContain('href="http://127.0.0.1:4200/billing"'); // cancel_url
    expect(html).not.toMatch(/<script|\sstyle=|\son[a-z]+=/i);
    expect(html).not.toContain('name="email"'); // the customer's e-mail is known
    const csp = response.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("form-action 'self' http://127.0.0.1:4200");
    expect((await fetch(`${fixture.baseUrl}/pay/assets/checkout.css`)).status).toBe(200);
  });

  it('takes the success card: 303 to success_url, session complete and paid, intent succeeded', async () => {
    const result = await payOnHostedPage(session.url ?? '', {
      number: SUCCESS_CARD,
      name: 'Ada Lovelace',
    });
    expect(result.status).toBe(303);
    expect(result.location).toBe(`http://127.0.0.1:4200/billing/done?session=${session.id}`);

    const paid = await fixture.stripe.checkout.sessions.retrieve(session.id, {
      expand: ['payment_intent.latest_charge'],
    });
    expect(paid).toMatchObject({
      status: 'complete',
      payment_status: 'paid',
      url: null,
      customer_details: { email: 'billing@lab.test', name: 'Ada Lovelace' },
    });
    const intent = paid.payment_intent as Stripe.PaymentIntent;
    expect(intent).toMatchObject({
      object: 'payment_intent',
      status: 'succeeded',
      amount: 7400,
      amount_received: 7400,
      currency: 'eur',
      customer: session.customer,
      metadata: { order: '42' },
    });
    expect(intent.id).toMatch(/^pi_/);
    expect(intent.latest_charge).toMatchObject({
      paid: true,
      payment_method_details: { card: { last4: '4242', brand: 'visa' } },
    });

    const types = (await fixture.stripe.events.list()).data.map((event) => event.type);
    expect(types).toEqual(
      expect.arrayContaining(['checkout.session.completed', 'payment_intent.succeeded']),
    );
    // Paying again is impossible: the page now sends the buyer on to the success URL.
    expect((await fetch(session.url ?? '', { redirect: 'manual' })).status).toBe(303);
  });

  it('shows a decline on the page, keeps the session open, and accepts a retry on the same intent', async () => {
    const declined = await payOnHostedPage(session.url ?? '', { number: DECLINED_CARD });
    expect(declined.status).toBe(402);
    expect(declined.html).toContain('Your card was declined.');
    expect(declined.html).toContain('name="card_number"');

    const open = await fixture.stripe.checkout.sessions.retrieve(session.id, {
      expand: ['payment_intent'],
    });
    expect(open.status).toBe('open');
    const failedIntent = open.payment_intent as Stripe.PaymentIntent;
    expect(failedIntent).toMatchObject({
      status: 'requires_payment_method',
      last_payment_error: {
        type: 'card_error',
        code: 'card_declined',
        decline_code: 'generic_decline',
      },
    });
    const failed = await fixture.stripe.events.list({ type: 'payment_intent.payment_failed' });
    expect(failed.data).toHaveLength(1);

    const retry = await payOnHostedPage(session.url ?? '', { number: SUCCESS_CARD });
    expect(retry.status).toBe(303);
    const paid = await fixture.stripe.checkout.sessions.retrieve(session.id);
    expect(paid.payment_intent).toBe(failedIntent.id);
    expect((await fixture.stripe.paymentIntents.retrieve(failedIntent.id)).status).toBe(
      'succeeded',
    );
  });

  it('rejects malformed card fields before charging anything', async () => {
    // 4242 4242 4242 4241 fails the Luhn check (ISO/IEC 7812-1 Annex B).
    const badNumber = await payOnHostedPage(session.url ?? '', { number: '4242 4242 4242 4241' });
    expect(badNumber.status).toBe(400);
    expect(badNumber.html).toContain('Your card number is invalid.');
    const past = await payOnHostedPage(session.url ?? '', {
      number: SUCCESS_CARD,
      expiry: '01 / 20',
    });
    expect(past.status).toBe(400);
    expect(past.html).toContain('in the past');
    expect((await fixture.stripe.paymentIntents.list()).data).toHaveLength(0);
  });

  it('asks for an e-mail when the session has none, and records it', async () => {
    const anonymous = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ success_url: undefined }),
    );
    const page = await (await fetch(anonymous.url ?? '')).text();
    expect(page).toContain('name="email"');
    const result = await payOnHostedPage(anonymous.url ?? '', {
      number: SUCCESS_CARD,
      email: 'walk-in@lab.test',
    });
    expect(result.status).toBe(200); // no success_url: our own confirmation page
    const paid = await fixture.stripe.checkout.sessions.retrieve(anonymous.id);
    expect(paid.customer_details?.email).toBe('walk-in@lab.test');
  });

  it('answers 404 for an unknown session', async () => {
    expect((await fetch(`${fixture.baseUrl}/pay/cs_test_unknown`)).status).toBe(404);
  });
});
