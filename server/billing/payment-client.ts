/**
 * The payment provider's official SDK client, built from configuration only: the same code talks
 * to the hosted API in production and to fakes/payments on 127.0.0.1 in development and tests.
 */
import Stripe from 'stripe';
import type { Config } from '../config/config';

/**
 * A client for `settings` (secret key, host, port, protocol). The SDK retries network failures
 * and 5xx answers `maxNetworkRetries` times with the same idempotency key; `timeoutMs` bounds one
 * attempt, so a request holding a database transaction cannot hang for the SDK's default 80 s.
 * @example createPaymentClient(loadConfig().payments).checkout.sessions.create({...})
 */
export function createPaymentClient(settings: Config['payments'], options: { maxNetworkRetries?: number; timeoutMs?: number } = {}): Stripe {
  return new Stripe(settings.secretKey, {
    host: settings.host,
    port: settings.port,
    protocol: settings.protocol,
    telemetry: false,
    maxNetworkRetries: options.maxNetworkRetries ?? 2,
    timeout: options.timeoutMs ?? 10_000,
  });
}
