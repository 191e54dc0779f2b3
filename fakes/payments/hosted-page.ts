import { Router, type Response } from 'express';
import type { CheckoutSession } from './checkout-objects';
import { readCardForm } from './card-form';
import { chargeCard, createPaymentIntent } from './card-payment';
import { completeSession, expireDueSessions, knownBuyerEmail } from './checkout-session-lifecycle';
import { requestParams } from './present-object';
import { HOSTED_PAGE_CSS } from './hosted-page-css';
import { renderPaymentPage, renderStatusPage, type PaymentFormState } from './hosted-page-html';
import type { PaymentsContext } from './payments-context';

/**
 * The hosted payment page a Checkout Session's `url` points at: `GET /pay/:sessionId` shows the
 * order and a card form, `POST /pay/:sessionId` charges the card. On approval the session becomes
 * complete / paid and the buyer is sent (303) to `success_url` with `{CHECKOUT_SESSION_ID}`
 * replaced, as Checkout does; a decline re-shows the form (402) with the issuer's message so the
 * buyer can retry, and the same PaymentIntent collects the next attempt.
 *
 * @param context - the stand-in context.
 * @returns a router to mount at /pay (expects a urlencoded body parser before it).
 */
export function hostedPageRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.get('/assets/checkout.css', (_request, response) => {
    response.type('text/css').set('Cache-Control', 'no-cache').send(HOSTED_PAGE_CSS);
  });

  router.get('/:sessionId', (request, response) => {
    const session = sessionOrStatusPage(context, String(request.params['sessionId']), response);
    if (!session) return;
    const form: PaymentFormState = {
      values: {},
      errors: {},
      declineMessage: null,
      needsEmail: knownBuyerEmail(context, session) === null,
    };
    sendPage(
      response,
      200,
      renderPaymentPage(session, store.state.lineItems[session.id] ?? [], form),
      session,
    );
  });

  router.post('/:sessionId', (request, response) => {
    const session = sessionOrStatusPage(context, String(request.params['sessionId']), response);
    if (!session) return;
    const knownEmail = knownBuyerEmail(context, session);
    const items = store.state.lineItems[session.id] ?? [];
    const form = readCardForm(requestParams(request), {
      needsEmail: knownEmail === null,
      knownEmail,
      now: new Date(),
    });
    if (!form.ok) {
      const state = {
        values: form.values,
        errors: form.errors,
        declineMessage: null,
        needsEmail: knownEmail === null,
      };
      sendPage(response, 400, renderPaymentPage(session, items, state), session);
      return;
    }
    const { card } = form;
    const error = store.mutate((state) => {
      const intentData = state.paymentIntentData[session.id] ?? { description: null, metadata: {} };
      const intent =
        (session.payment_intent && state.paymentIntents[session.payment_intent]) ||
        createPaymentIntent(context, {
          amount: session.amount_total,
          currency: session.currency,
          customer: session.customer,
          description: intentData.description,
          metadata: intentData.metadata,
          receiptEmail: card.email,
        });
      session.payment_intent = intent.id;
      const result = chargeCard(context, intent, card);
      if (!result.error) completeSession(context, session, { email: card.email, name: card.name });
      return result.error;
    });
    if (error) {
      const values = { ...requestParams(request) } as PaymentFormState['values'];
      const state = {
        values,
        errors: {},
        declineMessage: error.message,
        needsEmail: knownEmail === null,
      };
      sendPage(response, 402, renderPaymentPage(session, items, state), session);
      return;
    }
    sendPaid(response, session);
  });

  return router;
}

/** The open session, or undefined after answering with the page for a missing/expired/paid one. */
function sessionOrStatusPage(
  context: PaymentsContext,
  id: string,
  response: Response,
): CheckoutSession | undefined {
  expireDueSessions(context);
  const session = context.store.state.checkoutSessions[id];
  if (!session) {
    sendPage(
      response,
      404,
      renderStatusPage('Payment page not found', 'There is no payment with this link.', null),
    );
  } else if (session.status === 'expired') {
    const link = session.cancel_url
      ? { href: session.cancel_url, label: 'Return to the shop' }
      : null;
    sendPage(
      response,
      410,
      renderStatusPage('Payment page expired', 'This payment link has expired.', link),
    );
  } else if (session.status === 'complete') {
    sendPaid(response, session);
  } else {
    return session;
  }
  return undefined;
}

function sendPaid(response: Response, session: CheckoutSession): void {
  if (session.success_url) {
    response.redirect(303, session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id));
    return;
  }
  sendPage(
    response,
    200,
    renderStatusPage('Payment received', 'Thank you, your payment is complete.', null),
  );
}

/**
 * Sends a page with a CSP that allows nothing but our style sheet and posting the form to
 * ourselves; the success URL's origin is listed in form-action because browsers apply that
 * directive to the redirect after the POST as well.
 */
function sendPage(
  response: Response,
  status: number,
  html: string,
  session?: CheckoutSession,
): void {
  let formTargets = "'self'";
  if (session?.success_url) {
    try {
      formTargets += ` ${new URL(session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', 'x')).origin}`;
    } catch {
      // validated at creation; an unparsable URL only loses the extra origin
    }
  }
  response
    .status(status)
    .set(
      'Content-Security-Policy',
      `default-src 'none'; style-src 'self'; form-action ${formTargets}; base-uri 'none'; frame-ancestors 'none'`,
    )
    .set('Cache-Control', 'no-store')
    .set('X-Content-Type-Options', 'nosniff')
    .type('html')
    .send(html);
}
