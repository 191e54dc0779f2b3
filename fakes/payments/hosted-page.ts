import { Router } from 'express';
import { readCardForm } from './card-form';
import { chargeCard } from './card-payment';
import { createPaymentIntent } from './payment-intent-create';
import { completeSession, knownBuyerEmail } from './checkout-session-lifecycle';
import { requestParams } from './present-object';
import { HOSTED_PAGE_CSS } from './hosted-page-css';
import { renderPaymentPage, type PaymentFormState } from './hosted-page-html';
import { sendHostedPage, sendPaid, sessionOrStatusPage } from './hosted-page-response';
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
    sendHostedPage(
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
      sendHostedPage(response, 400, renderPaymentPage(session, items, state), session);
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
      sendHostedPage(response, 402, renderPaymentPage(session, items, state), session);
      return;
    }
    sendPaid(response, session);
  });

  return router;
}
