/**
 * POST /api/billing/webhook: the payment provider's signed event deliveries. Public (no sign-in),
 * so the signature is the only proof of origin: the body arrives raw (express.raw in app.ts) and
 * is verified with the SDK's constructEvent before anything is read from it. Applying an event
 * spans organizations (the lab's ledger, the buyer's purchase), hence system scope (asSystem),
 * in one transaction; the answer is 200 once it commits, so the provider retries on any failure.
 */
import Stripe from 'stripe';
import { route, type RouteDef } from '../http/route';
import { badRequest } from '../http/problem';
import { asSystem } from '../tenancy/tenant-transaction';
import { applyPaymentEvent } from './apply-payment-event';
import type { BillingDeps } from './billing-deps';

export function webhookRoute(deps: BillingDeps): RouteDef {
  return route({
    method: 'post',
    path: '/billing/webhook',
    summary: 'Payment provider events (signed); adds purchased credits once per payment',
    access: { kind: 'public' },
    transaction: 'none',
    async handler(ctx) {
      const raw = ctx.req.body as unknown;
      const signature = ctx.req.header('stripe-signature');
      if (!Buffer.isBuffer(raw) || raw.length === 0) throw badRequest('The webhook needs the event as its body.');
      if (!signature) throw badRequest('The webhook needs a Stripe-Signature header.');
      let event: Stripe.Event;
      try {
        event = deps.payments.webhooks.constructEvent(raw, signature, deps.webhookSecret);
      } catch (error) {
        if (error instanceof Stripe.errors.StripeSignatureVerificationError) throw badRequest('The webhook signature does not match this body.');
        // Signed, but not JSON: retrying cannot help, so a 400 rather than a 500.
        if (error instanceof SyntaxError) throw badRequest('The webhook body is signed but is not JSON.');
        throw error;
      }
      if (!isWellFormedEvent(event)) throw badRequest('The webhook event is not well formed: it needs a string id and type, and data.object with a string id.');
      const outcome = await asSystem(deps.sequelize, (t) => applyPaymentEvent(deps, t, event));
      ctx.status(200);
      return { received: true, eventId: event.id, outcome };
    },
  });
}

/** The parts of an event every handler reads: a signed body can still be any JSON (a leaked secret, a provider fault). */
function isWellFormedEvent(event: unknown): event is Stripe.Event {
  const e = event as { id?: unknown; type?: unknown; data?: { object?: unknown } } | null;
  const object = e?.data?.object as { id?: unknown } | null | undefined;
  return typeof e === 'object' && e !== null && !Array.isArray(e) && typeof e.id === 'string' && typeof e.type === 'string' && typeof object === 'object' && object !== null && !Array.isArray(object) && typeof object.id === 'string';
}
