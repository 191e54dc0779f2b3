import { createServer } from 'node:http';
import { closeHttpServer, listenOnLoopback } from '../loopback-listen';

/** One webhook request as the receiver saw it: the raw body (needed for signature checks). */
export type ReceivedWebhook = {
  body: string;
  signature: string;
  contentType: string;
  receivedAtMs: number;
};

/** A local webhook endpoint for specs. */
export type WebhookReceiver = {
  url: string;
  received: ReceivedWebhook[];
  /** Resolves once `count` requests have arrived. @throws after `timeoutMs`. */
  waitFor(count: number, timeoutMs?: number): Promise<ReceivedWebhook[]>;
  close(): Promise<void>;
};

/**
 * Starts an HTTP endpoint that records every POST and answers the n-th request with
 * `statuses[n]` (the last status repeats), e.g. [500, 500, 200] to force two retries.
 */
export async function startWebhookReceiver(statuses: number[] = [200]): Promise<WebhookReceiver> {
  const received: ReceivedWebhook[] = [];
  const server = createServer((request, response) => {
    const chunks: Buffer[] = [];
    request.on('data', (chunk: Buffer) => chunks.push(chunk));
    request.on('end', () => {
      received.push({
        body: Buffer.concat(chunks).toString('utf8'),
        signature: String(request.headers['stripe-signature'] ?? ''),
        contentType: String(request.headers['content-type'] ?? ''),
        receivedAtMs: Date.now(),
      });
      response.statusCode = statuses[Math.min(received.length - 1, statuses.length - 1)];
      response.end();
    });
  });
  const port = await listenOnLoopback(server, 0);
  return {
    url: `http://127.0.0.1:${port}/webhooks/payments`,
    received,
    async waitFor(count, timeoutMs = 5000) {
      const deadline = Date.now() + timeoutMs;
      while (received.length < count) {
        if (Date.now() > deadline)
          throw new Error(`waitFor: ${received.length} of ${count} webhooks in ${timeoutMs} ms`);
        await new Promise((resolve) => setTimeout(resolve, 10));
      }
      return received.slice(0, count);
    },
    close: () => closeHttpServer(server),
  };
}
