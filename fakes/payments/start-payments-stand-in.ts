import { createServer } from 'node:http';
import { closeHttpServer, listenOnLoopback, LOOPBACK_HOST } from '../loopback-listen';
import { expireDueSessions } from './checkout-session-lifecycle';
import { createPaymentsApp } from './payments-app';
import type { PaymentsContext } from './payments-context';
import { retryDelayMs } from './retry-delay';
import { PaymentsStore } from './store';
import { WebhookDeliveryWorker } from './webhook-delivery';

/** Options of {@link startPaymentsStandIn}. */
export type PaymentsStandInOptions = {
  /** Port on 127.0.0.1; 0 = ephemeral. */
  port: number;
  /** Folder for the persisted state (created when missing). */
  dataDir: string;
  /** The secret key clients must present. */
  secretKey: string;
  /** Webhook endpoint(s); several may be given comma-separated. */
  webhookUrl?: string;
  /** Signing secret for the webhook signatures; required with `webhookUrl`. */
  webhookSecret?: string;
  /** First retry delay of a failed delivery, doubling after each failure; default 1000 ms. */
  retryBaseMs?: number;
  /** Longest retry delay; default 5 min. */
  retryCapMs?: number;
  /** Time allowed per delivery attempt; default 10 s. */
  webhookTimeoutMs?: number;
};

/** A running payments stand-in. */
export type PaymentsStandIn = { close(): Promise<void>; port: number };

/**
 * Starts the local payments stand-in: the subset of the payment API Sidecheck uses, its hosted
 * payment page and signed webhook delivery, on 127.0.0.1 only. State is loaded from and saved to
 * `dataDir`; deliveries still pending from an earlier run resume.
 *
 * @param options - see {@link PaymentsStandInOptions}.
 * @returns the running stand-in with its real port.
 * @throws TypeError for a missing secret key or a webhook URL without a secret, RangeError for
 *   impossible retry settings; listen errors.
 * @example const payments = await startPaymentsStandIn({ port: 0, dataDir, secretKey: 'sk_test_local' })
 */
export async function startPaymentsStandIn(
  options: PaymentsStandInOptions,
): Promise<PaymentsStandIn> {
  if (!options.secretKey) throw new TypeError('startPaymentsStandIn: secretKey is required');
  const webhookUrls = (options.webhookUrl ?? '')
    .split(',')
    .map((url) => url.trim())
    .filter(Boolean);
  for (const url of webhookUrls) new URL(url); // throws TypeError for a malformed URL
  if (webhookUrls.length && !options.webhookSecret) {
    throw new TypeError('startPaymentsStandIn: webhookSecret is required when webhookUrl is set');
  }
  const retryBaseMs = options.retryBaseMs ?? 1000;
  const retryCapMs = options.retryCapMs ?? Math.max(5 * 60 * 1000, retryBaseMs);
  retryDelayMs(1, { retryBaseMs, retryCapMs }); // throws RangeError for impossible settings now
  const store = PaymentsStore.open(options.dataDir);
  const worker = new WebhookDeliveryWorker(store, {
    secret: options.webhookSecret ?? '',
    retryBaseMs,
    retryCapMs,
    timeoutMs: options.webhookTimeoutMs ?? 10_000,
  });
  const context: PaymentsContext = {
    store,
    secretKey: options.secretKey,
    webhookUrls,
    baseUrl: '',
    wakeDelivery: () => worker.wake(),
  };
  const server = createServer(createPaymentsApp(context, worker));
  const port = await listenOnLoopback(server, options.port);
  context.baseUrl = `http://${LOOPBACK_HOST}:${port}`;
  // Open sessions from an earlier run keep working if the port changed.
  store.mutate((state) => {
    for (const session of Object.values(state.checkoutSessions)) {
      if (session.status === 'open') session.url = `${context.baseUrl}/pay/${session.id}`;
    }
  });
  expireDueSessions(context);
  const expiryTimer = setInterval(() => expireDueSessions(context), 30_000).unref();
  worker.wake();

  return {
    port,
    async close() {
      clearInterval(expiryTimer);
      await worker.close();
      await closeHttpServer(server);
    },
  };
}
