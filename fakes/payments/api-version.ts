/**
 * API version the stand-in reports on events and in the `Stripe-Version` response header: the
 * version the installed SDK (stripe 23.1.0) pins, so objects decode the way the SDK expects.
 * A spec checks this against the SDK's own `Stripe.API_VERSION`.
 */
export const PAYMENTS_API_VERSION = '2026-10-28.endive';
