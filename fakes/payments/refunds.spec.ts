import type Stripe from 'stripe';
import { payOnHostedPage } from './hosted-page-client';
import {
  buildCheckoutSessionParams,
  startPaymentsFixture,
  type PaymentsFixture,
} from './payments-fixture';

// Refund rules from the public API reference (from memory): amount defaults to what is left,
// a refund may not exceed it, the charge records amount_refunded and becomes refunded at the full
// amount; refund.created and charge.refunded are emitted.
describe('refunds through the SDK', () => {
  let fixture: PaymentsFixture;
  let intentId: string;

  beforeEach(async () => {
    fixture = await startPaymentsFixture();
    const session = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer_email: 'a@lab.test' }),
    );
    await payOnHostedPage(session.url ?? '', { number: '4242424242424242' });
    intentId = String((await fixture.stripe.checkout.sessions.retrieve(session.id)).payment_intent);
  });
  afterEach(() => fixture.close());

  const charge = async (): Promise<Stripe.Charge> => {
    const intent = await fixture.stripe.paymentIntents.retrieve(intentId, {
      expand: ['latest_charge'],
    });
    return intent.latest_charge as Stripe.Charge;
  };

  it('refunds part, then the rest by default, tracking amount_refunded on the charge', async () => {
    const partial = await fixture.stripe.refunds.create({
      payment_intent: intentId,
      amount: 2500,
      reason: 'requested_by_customer',
    });
    expect(partial).toMatchObject({
      object: 'refund',
      amount: 2500,
      status: 'succeeded',
      currency: 'eur',
      payment_intent: intentId,
      reason: 'requested_by_customer',
    });
    expect(partial.id).toMatch(/^re_/);
    expect(await charge()).toMatchObject({ amount: 7400, amount_refunded: 2500, refunded: false });

    const rest = await fixture.stripe.refunds.create({ payment_intent: intentId });
    expect(rest.amount).toBe(7400 - 2500);
    expect(await charge()).toMatchObject({ amount_refunded: 7400, refunded: true });

    const listed = await fixture.stripe.refunds.list({ payment_intent: intentId });
    expect(listed.data.map((refund) => refund.id)).toEqual([rest.id, partial.id]);
    expect((await fixture.stripe.refunds.retrieve(partial.id)).amount).toBe(2500);

    const refunded = await fixture.stripe.events.list({ type: 'charge.refunded' });
    expect(refunded.data).toHaveLength(2);
    expect(refunded.data[0].data.previous_attributes).toMatchObject({
      amount_refunded: 2500,
      refunded: false,
    });
    expect((await fixture.stripe.events.list({ type: 'refund.created' })).data).toHaveLength(2);
  });

  it('refuses more than is left, a second full refund and an unpaid intent', async () => {
    await expect(
      fixture.stripe.refunds.create({ payment_intent: intentId, amount: 7401 }),
    ).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      statusCode: 400,
      param: 'amount',
    });
    await fixture.stripe.refunds.create({ payment_intent: intentId });
    await expect(fixture.stripe.refunds.create({ payment_intent: intentId })).rejects.toMatchObject(
      {
        statusCode: 400,
        code: 'charge_already_refunded',
      },
    );

    const open = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer_email: 'b@lab.test' }),
    );
    await payOnHostedPage(open.url ?? '', { number: '4000000000000002' });
    const declinedIntent = String(
      (await fixture.stripe.checkout.sessions.retrieve(open.id)).payment_intent,
    );
    await expect(
      fixture.stripe.refunds.create({ payment_intent: declinedIntent }),
    ).rejects.toMatchObject({
      statusCode: 400,
      param: 'payment_intent',
    });
  });

  it('refunds by charge id too', async () => {
    const refund = await fixture.stripe.refunds.create({
      charge: (await charge()).id,
      amount: 100,
    });
    expect(refund).toMatchObject({ amount: 100, payment_intent: intentId });
  });
});
