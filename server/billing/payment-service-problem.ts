/** How a failure of the payment provider reaches the caller: a 503 that says nothing was charged. */
import Stripe from 'stripe';
import { serviceUnavailable, type Problem } from '../http/problem';

/**
 * A Problem for an error the payment SDK threw (unreachable, timed out, refused our request),
 * or null when `error` is not the SDK's, so the caller rethrows it unchanged.
 * @example paymentServiceProblem(new Stripe.errors.StripeConnectionError({ message: 'x' }))?.status // 503
 */
export function paymentServiceProblem(error: unknown): Problem | null {
  if (!(error instanceof Stripe.errors.StripeError)) return null;
  return serviceUnavailable('The payment service is not available right now, and nothing was charged. Try again in a minute.');
}
