import Stripe from 'stripe';
import { PAYMENTS_API_VERSION } from './api-version';
import {
  startPaymentsFixture,
  stripeClientFor,
  TEST_SECRET_KEY,
  type PaymentsFixture,
} from './payments-fixture';

// The SDK's own error mapping (stripe-node's generateV1Error) is the reference: the stand-in has to
// send status codes and error bodies that land in the right class.
describe('API errors and authentication', () => {
  let fixture: PaymentsFixture;
  beforeAll(async () => (fixture = await startPaymentsFixture()));
  afterAll(() => fixture.close());

  it('reports the API version the installed SDK pins', async () => {
    expect(PAYMENTS_API_VERSION).toBe(Stripe.API_VERSION);
    const response = await fetch(`${fixture.baseUrl}/v1/events`, {
      headers: { Authorization: `Bearer ${TEST_SECRET_KEY}` },
    });
    expect(response.headers.get('stripe-version')).toBe(Stripe.API_VERSION);
    expect(response.headers.get('request-id')).toMatch(/^req_/);
  });

  it('answers a wrong key with 401 → StripeAuthenticationError', async () => {
    const wrong = stripeClientFor(fixture.standIn.port, 'sk_test_wrong_key_000000');
    const attempt = wrong.customers.list();
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    await expect(attempt).rejects.toMatchObject({ statusCode: 401 });
    await expect(attempt).rejects.not.toMatchObject({
      message: expect.stringContaining('wrong_key'),
    });
  });

  it('answers a missing key with 401 and accepts Basic auth with the key as user name', async () => {
    expect((await fetch(`${fixture.baseUrl}/v1/customers`)).status).toBe(401);
    const basic = Buffer.from(`${TEST_SECRET_KEY}:`).toString('base64');
    const response = await fetch(`${fixture.baseUrl}/v1/customers`, {
      headers: { Authorization: `Basic ${basic}` },
    });
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ object: 'list', data: [] });
  });

  it('guards the test controls with the key too', async () => {
    expect((await fetch(`${fixture.baseUrl}/_control/deliveries`)).status).toBe(401);
  });

  it('maps a declined server-side confirmation to 402 → StripeCardError with the intent', async () => {
    const attempt = fixture.stripe.paymentIntents.create({
      amount: 2500,
      currency: 'eur',
      payment_method: 'pm_card_chargeDeclined',
      confirm: true,
    });
    await expect(attempt).rejects.toBeInstanceOf(Stripe.errors.StripeCardError);
    const error = (await attempt.catch(
      (caught: unknown) => caught,
    )) as Stripe.errors.StripeCardError;
    expect(error).toMatchObject({
      statusCode: 402,
      rawType: 'card_error',
      code: 'card_declined',
      decline_code: 'generic_decline',
      message: 'Your card was declined.',
    });
    expect(error.payment_intent).toMatchObject({
      object: 'payment_intent',
      status: 'requires_payment_method',
    });
    const stored = await fixture.stripe.paymentIntents.retrieve(error.payment_intent?.id ?? '');
    expect(stored.last_payment_error).toMatchObject({
      code: 'card_declined',
      decline_code: 'generic_decline',
    });
  });

  it('confirms a server-side payment with pm_card_visa', async () => {
    const intent = await fixture.stripe.paymentIntents.create({
      amount: 2500,
      currency: 'eur',
      payment_method: 'pm_card_visa',
      confirm: true,
      expand: ['latest_charge'],
    });
    expect(intent).toMatchObject({ status: 'succeeded', amount_received: 2500 });
    expect(intent.latest_charge).toMatchObject({
      object: 'charge',
      paid: true,
      amount_captured: 2500,
      payment_method_details: { card: { brand: 'visa', last4: '4242' } },
    });
  });

  it('maps missing objects to 404 → StripeInvalidRequestError, missing params to 400', async () => {
    const missing = fixture.stripe.checkout.sessions.retrieve('cs_test_doesnotexist');
    await expect(missing).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    await expect(missing).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
    await expect(fixture.stripe.refunds.create({})).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      param: 'payment_intent',
    });
  });

  it('answers unknown API paths with a JSON 404 in the error shape', async () => {
    const response = await fetch(`${fixture.baseUrl}/v1/subscriptions`, {
      headers: { Authorization: `Bearer ${TEST_SECRET_KEY}` },
    });
    expect(response.status).toBe(404);
    expect(await response.json()).toEqual({
      error: {
        type: 'invalid_request_error',
        message: 'Unrecognized request URL (GET: /v1/subscriptions).',
      },
    });
  });
});
