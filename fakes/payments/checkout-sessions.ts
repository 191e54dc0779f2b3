import { Router } from 'express';
import { invalidParam, noSuch } from './api-error';
import type { CheckoutSession, LineItem } from './checkout-objects';
import { createCheckoutSession } from './checkout-session-create';
import { readCheckoutSessionParams } from './checkout-session-params';
import { expireDueSessions, expireSession } from './checkout-session-lifecycle';
import { expandObject, lineItemsList } from './expand-fields';
import { optionalEnum, optionalString } from './form-params';
import { createdFilter, listPage } from './list-page';
import type { PaymentsContext } from './payments-context';
import { presentObject, requestExpand, requestParams } from './present-object';

/**
 * Checkout Sessions: `POST /v1/checkout/sessions`, `GET /v1/checkout/sessions/:id`,
 * `GET /v1/checkout/sessions/:id/line_items`, `GET /v1/checkout/sessions` (filters customer,
 * payment_intent, status, created), `POST /v1/checkout/sessions/:id/expire`. A session's `url`
 * is the stand-in's own hosted payment page.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 */
export function checkoutSessionsRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;
  router.use('/checkout/sessions', (_request, _response, next) => {
    expireDueSessions(context);
    next();
  });

  router.post('/checkout/sessions', (request, response) => {
    const draft = readCheckoutSessionParams(store.state, requestParams(request));
    const session = store.mutate(() => createCheckoutSession(context, draft));
    response.json(presentObject(context, request, session));
  });

  router.get('/checkout/sessions/:id', (request, response) => {
    response.json(
      presentObject(context, request, findSession(context, String(request.params['id']))),
    );
  });

  router.get('/checkout/sessions/:id/line_items', (request, response) => {
    const session = findSession(context, String(request.params['id']));
    const items = lineItemsList(store.state, session.id).data as LineItem[];
    const page = listPage(
      items,
      requestParams(request),
      `/v1/checkout/sessions/${session.id}/line_items`,
      (i) => i,
    );
    response.json(expandObject(store.state, page, requestExpand(request)));
  });

  router.get('/checkout/sessions', (request, response) => {
    const query = requestParams(request);
    const customer = optionalString(query, 'customer');
    const paymentIntent = optionalString(query, 'payment_intent');
    const status = optionalEnum(query, 'status', ['open', 'complete', 'expired'] as const);
    const inRange = createdFilter(query);
    const matches = Object.values(store.state.checkoutSessions)
      .reverse()
      .filter(
        (session) =>
          (customer === undefined || session.customer === customer) &&
          (paymentIntent === undefined || session.payment_intent === paymentIntent) &&
          (status === undefined || session.status === status) &&
          inRange(session.created),
      );
    const page = listPage(matches, query, '/v1/checkout/sessions', (session) => session);
    response.json(expandObject(store.state, page, requestExpand(request)));
  });

  router.post('/checkout/sessions/:id/expire', (request, response) => {
    const session = findSession(context, String(request.params['id']));
    if (session.status !== 'open') {
      throw invalidParam(
        'session',
        `Only Checkout Sessions with a status in ["open"] can be expired. This one is '${session.status}'.`,
      );
    }
    store.mutate(() => expireSession(context, session));
    response.json(presentObject(context, request, session));
  });

  return router;
}

function findSession(context: PaymentsContext, id: string): CheckoutSession {
  const session = context.store.state.checkoutSessions[id];
  if (!session) throw noSuch('checkout.session', id);
  return session;
}
