import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Stripe from 'stripe';
import {
  startPaymentsStandIn,
  type PaymentsStandIn,
  type PaymentsStandInOptions,
} from './start-payments-stand-in';

/** Keys used by the specs; any non-empty strings work with the stand-in. */
export const TEST_SECRET_KEY = 'sk_test_sidecheck_stand_in_0001';
export const TEST_WEBHOOK_SECRET = 'whsec_sidecheck_stand_in_0001';

/** A running stand-in in a temporary folder, with an official SDK client pointed at it. */
export type PaymentsFixture = {
  standIn: PaymentsStandIn;
  stripe: Stripe;
  dataDir: string;
  baseUrl: string;
  /** Stops and starts again on the same folder (new port), as after a crash or deploy. */
  restart(): Promise<void>;
  /** Stops the stand-in and deletes the folder. */
  close(): Promise<void>;
};

/**
 * The SDK client exactly as the app builds it for the stand-in: only host, port and protocol
 * differ from production configuration.
 *
 * @param port - the stand-in's port.
 * @param key - secret key to present.
 * @param maxNetworkRetries - SDK retries (0 keeps failures immediate in specs).
 */
export function stripeClientFor(
  port: number,
  key = TEST_SECRET_KEY,
  maxNetworkRetries = 0,
): Stripe {
  return new Stripe(key, {
    host: '127.0.0.1',
    port,
    protocol: 'http',
    telemetry: false,
    maxNetworkRetries,
  });
}

/**
 * Starts a payments stand-in on an ephemeral port in a fresh temporary folder.
 * @param options - overrides of the stand-in options (webhook URL, retry base…).
 */
export async function startPaymentsFixture(
  options: Partial<PaymentsStandInOptions> = {},
): Promise<PaymentsFixture> {
  const dataDir = await mkdtemp(join(tmpdir(), 'payments-stand-in-'));
  const settings: PaymentsStandInOptions = {
    port: 0,
    dataDir,
    secretKey: TEST_SECRET_KEY,
    ...options,
  };
  const standIn = await startPaymentsStandIn(settings).catch(async (error: unknown) => {
    await rm(dataDir, { recursive: true, force: true }); // no stray temp folders on a failed start
    throw error;
  });
  const fixture: PaymentsFixture = {
    standIn,
    stripe: undefined as unknown as Stripe,
    dataDir,
    baseUrl: '',
    async restart() {
      await fixture.standIn.close();
      fixture.standIn = await startPaymentsStandIn(settings);
      connect();
    },
    async close() {
      await fixture.standIn.close();
      await rm(dataDir, { recursive: true, force: true });
    },
  };
  const connect = () => {
    fixture.stripe = stripeClientFor(fixture.standIn.port);
    fixture.baseUrl = `http://127.0.0.1:${fixture.standIn.port}`;
  };
  connect();
  return fixture;
}

/** A Checkout Session like the ones Sidecheck creates: one line item, success and cancel URLs. */
export function buildCheckoutSessionParams(
  overrides: Partial<Stripe.Checkout.SessionCreateParams> = {},
): Stripe.Checkout.SessionCreateParams {
  return {
    mode: 'payment',
    line_items: [
      {
        price_data: {
          currency: 'eur',
          unit_amount: 4900,
          product_data: { name: 'Sidecheck Lab, 1 month' },
        },
        quantity: 1,
      },
      {
        price_data: {
          currency: 'eur',
          unit_amount: 1250,
          product_data: { name: 'Signed report credits' },
        },
        quantity: 2,
      },
    ],
    success_url: 'http://127.0.0.1:4200/billing/done?session={CHECKOUT_SESSION_ID}',
    cancel_url: 'http://127.0.0.1:4200/billing',
    metadata: { tenant: 'lab-42' },
    client_reference_id: 'order-42',
    ...overrides,
  };
}
