import { createHmac } from 'node:crypto';

/**
 * The `Stripe-Signature` header value for one webhook request, in the documented scheme:
 * `t=<unix seconds>,v1=<hex HMAC-SHA256(secret, "<t>.<raw body>")>`. The SDK's
 * `webhooks.constructEvent(rawBody, header, secret)` verifies exactly this (and rejects
 * timestamps older than its 300 s tolerance).
 *
 * @param payload - the exact request body bytes as a string.
 * @param secret - the endpoint's signing secret (conventionally 'whsec_…').
 * @param timestampSeconds - Unix time of the attempt, integer seconds.
 * @returns the header value.
 * @throws TypeError when the secret is empty or the timestamp is not an integer.
 * @example signatureHeader('{}', 'whsec_x', 1700000000) // 't=1700000000,v1=…64 hex…'
 */
export function signatureHeader(payload: string, secret: string, timestampSeconds: number): string {
  if (!secret) throw new TypeError('signatureHeader: secret must not be empty');
  if (!Number.isInteger(timestampSeconds)) {
    throw new TypeError(
      `signatureHeader: timestamp must be integer seconds, got ${timestampSeconds}`,
    );
  }
  const signature = createHmac('sha256', secret)
    .update(`${timestampSeconds}.${payload}`, 'utf8')
    .digest('hex');
  return `t=${timestampSeconds},v1=${signature}`;
}
