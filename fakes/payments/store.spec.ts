import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type Stripe from 'stripe';
import { payOnHostedPage } from './hosted-page-client';
import {
  buildCheckoutSessionParams,
  startPaymentsFixture,
  TEST_SECRET_KEY,
  type PaymentsFixture,
} from './payments-fixture';
import { startPaymentsStandIn } from './start-payments-stand-in';
import { PaymentsStore, STATE_FILE_NAME } from './store';

describe('persisted state', () => {
  let fixture: PaymentsFixture;
  beforeEach(async () => (fixture = await startPaymentsFixture()));
  afterEach(() => fixture.close());

  it('keeps customers, sessions, payments and events across a restart', async () => {
    const customer = await fixture.stripe.customers.create({ email: 'keep@lab.test' });
    const paid = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer: customer.id }),
    );
    await payOnHostedPage(paid.url ?? '', { number: '4242424242424242' });
    const open = await fixture.stripe.checkout.sessions.create(
      buildCheckoutSessionParams({ customer: customer.id }),
    );
    const eventCount = (await fixture.stripe.events.list({ limit: 100 })).data.length;
    const oldPort = fixture.standIn.port;

    await fixture.restart();

    expect(fixture.standIn.port).not.toBe(oldPort);
    expect((await fixture.stripe.customers.retrieve(customer.id)) as Stripe.Customer).toMatchObject(
      { email: 'keep@lab.test' },
    );
    const reloaded = await fixture.stripe.checkout.sessions.retrieve(paid.id, {
      expand: ['payment_intent'],
    });
    expect(reloaded).toMatchObject({ status: 'complete', payment_status: 'paid' });
    expect((reloaded.payment_intent as Stripe.PaymentIntent).status).toBe('succeeded');
    expect((await fixture.stripe.events.list({ limit: 100 })).data).toHaveLength(eventCount);
    // An open session's page follows the stand-in to its new port.
    const reopened = await fixture.stripe.checkout.sessions.retrieve(open.id);
    expect(reopened.url).toBe(`${fixture.baseUrl}/pay/${open.id}`);
    expect((await payOnHostedPage(reopened.url ?? '', { number: '4242424242424242' })).status).toBe(
      303,
    );
  });

  it('writes one JSON document atomically, leaving no temporary files', async () => {
    await fixture.stripe.customers.create({ name: 'Atomic' });
    expect(readdirSync(fixture.dataDir)).toEqual([STATE_FILE_NAME]);
    const state = JSON.parse(readFileSync(join(fixture.dataDir, STATE_FILE_NAME), 'utf8')) as {
      customers: object;
    };
    expect(Object.values(state.customers)).toEqual([expect.objectContaining({ name: 'Atomic' })]);
  });

  it('refuses to start on a corrupt state file instead of silently starting empty', async () => {
    await fixture.standIn.close();
    writeFileSync(join(fixture.dataDir, STATE_FILE_NAME), '{"version": 7}');
    expect(() => PaymentsStore.open(fixture.dataDir)).toThrow(/not a version 1 state file/);
    await expect(
      startPaymentsStandIn({ port: 0, dataDir: fixture.dataDir, secretKey: TEST_SECRET_KEY }),
    ).rejects.toThrow();
    fixture.standIn = await startPaymentsStandIn({
      port: 0,
      dataDir: `${fixture.dataDir}/fresh`,
      secretKey: TEST_SECRET_KEY,
    });
  });

  it('forgets everything on the reset control', async () => {
    await fixture.stripe.customers.create({});
    const reset = await fetch(`${fixture.baseUrl}/_control/reset`, {
      method: 'POST',
      headers: { Authorization: `Bearer ${TEST_SECRET_KEY}` },
    });
    expect(reset.status).toBe(200);
    expect((await fixture.stripe.customers.list()).data).toEqual([]);
    expect((await fixture.stripe.events.list()).data).toEqual([]);
  });
});
