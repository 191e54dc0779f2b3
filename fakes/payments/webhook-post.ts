import { request as httpRequest } from 'node:http';
import { request as httpsRequest } from 'node:https';
import { signatureHeader } from './webhook-signature';

/**
 * POSTs one event as a webhook: JSON body, `Stripe-Signature` computed for this attempt's time
 * (so a retry hours later still passes the receiver's 300 s tolerance).
 *
 * @param url - the endpoint.
 * @param body - the serialised event, sent and signed byte for byte.
 * @param options.secret - the signing secret.
 * @param options.timeoutMs - see {@link postWebhook}.
 * @param options.signal - see {@link postWebhook}.
 * @returns the response status code.
 * @throws on connection errors, timeouts and aborts.
 * @example await postSignedEvent(url, JSON.stringify(event), { secret, timeoutMs: 10000 }) // 200
 */
export function postSignedEvent(
  url: string,
  body: string,
  options: { secret: string; timeoutMs: number; signal?: AbortSignal },
): Promise<number> {
  const headers = {
    'Content-Type': 'application/json; charset=utf-8',
    'Stripe-Signature': signatureHeader(body, options.secret, Math.floor(Date.now() / 1000)),
    'User-Agent': 'sidecheck-payments-stand-in/1 (webhook delivery)',
  };
  return postWebhook(url, body, headers, options);
}

/**
 * POSTs one webhook body and resolves with the HTTP status. A fresh connection per attempt (no
 * keep-alive agent), so closing the stand-in never waits on pooled sockets; the response body
 * is read and discarded.
 *
 * @param url - http: or https: endpoint.
 * @param body - the exact bytes that were signed.
 * @param headers - request headers (signature, content type…).
 * @param options.timeoutMs - give up after this long without an answer.
 * @param options.signal - aborts the attempt (used on shutdown).
 * @returns the response status code.
 * @throws on connection errors, timeouts and aborts (rejected promise).
 * @example await postWebhook('http://127.0.0.1:4000/hooks', '{}', {}, { timeoutMs: 10000 }) // 200
 */
export function postWebhook(
  url: string,
  body: string,
  headers: Record<string, string>,
  options: { timeoutMs: number; signal?: AbortSignal },
): Promise<number> {
  return new Promise((resolve, reject) => {
    const target = new URL(url);
    const send = target.protocol === 'https:' ? httpsRequest : httpRequest;
    const request = send(
      target,
      {
        method: 'POST',
        agent: false,
        headers: {
          ...headers,
          'Content-Length': String(Buffer.byteLength(body)),
          Connection: 'close',
        },
        timeout: options.timeoutMs,
        signal: options.signal,
      },
      (response) => {
        response.resume();
        response.on('end', () => resolve(response.statusCode ?? 0));
        response.on('error', reject);
      },
    );
    request.on('timeout', () =>
      request.destroy(new Error(`no answer within ${options.timeoutMs} ms`)),
    );
    request.on('error', reject);
    request.end(body);
  });
}
