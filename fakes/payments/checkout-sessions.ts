import { Router } from 'express';
import { invalidParam, noSuch } from './api-error';
import type { CheckoutSession, LineItem, Price, Product } from './checkout-objects';
import { readCheckoutSessionParams, type CheckoutSessionDraft } from './checkout-session-params';
import { expireDueSessions, expireSession } from './checkout-session-lifecycle';
import { expandObject, lineItemsList } from './expand-fields';
import { optionalEnum, optionalString } from './form-params';
import { createdFilter, listPage } from './list-page';
import { newObjectId, unixNow } from './object-id';
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
    const session = store.mutate(() => createSession(context, draft));
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

/** Stores a new open session, its ad-hoc products, prices and line items. */
function createSession(context: PaymentsContext, draft: CheckoutSessionDraft): CheckoutSession {
  const { state } = context.store;
  const created = unixNow();
  const id = newObjectId('cs_test', 58);
  const items = draft.items.map((item): LineItem => {
    const product: Product = {
      id: newObjectId('prod', 14),
      object: 'product',
      active: false,
      created,
      description: item.description,
      images: [],
      livemode: false,
      metadata: item.productMetadata,
      name: item.name,
      updated: created,
    };
    state.products[product.id] = product;
    const price: Price = {
      id: newObjectId('price'),
      object: 'price',
      active: false,
      billing_scheme: 'per_unit',
      created,
      currency: draft.currency,
      livemode: false,
      metadata: {},
      product: product.id,
      recurring: null,
      tax_behavior: 'unspecified',
      type: 'one_time',
      unit_amount: item.unitAmount,
      unit_amount_decimal: String(item.unitAmount),
    };
    const amount = item.unitAmount * item.quantity;
    return {
      id: newObjectId('li'),
      object: 'item',
      amount_discount: 0,
      amount_subtotal: amount,
      amount_tax: 0,
      amount_total: amount,
      currency: draft.currency,
      description: item.name,
      price,
      quantity: item.quantity,
    };
  });
  const total = items.reduce((sum, item) => sum + item.amount_total, 0);
  const session: CheckoutSession = {
    id,
    object: 'checkout.session',
    amount_subtotal: total,
    amount_total: total,
    cancel_url: draft.cancelUrl,
    client_reference_id: draft.clientReferenceId,
    created,
    currency: draft.currency,
    customer: draft.customer,
    customer_creation: draft.customer ? null : 'if_required',
    customer_details: null,
    customer_email: draft.customerEmail,
    expires_at: draft.expiresAt,
    livemode: false,
    locale: draft.locale,
    metadata: draft.metadata,
    mode: 'payment',
    payment_intent: null,
    payment_method_types: ['card'],
    payment_status: 'unpaid',
    status: 'open',
    success_url: draft.successUrl,
    total_details: { amount_discount: 0, amount_shipping: 0, amount_tax: 0 },
    ui_mode: 'hosted',
    url: `${context.baseUrl}/pay/${id}`,
  };
  state.checkoutSessions[id] = session;
  state.lineItems[id] = items;
  // Real Checkout sends no event on creation either, and creates the PaymentIntent only when the
  // buyer pays (API versions since 2022-08-01, from memory): payment_intent stays null until then.
  state.paymentIntentData[id] = draft.paymentIntentData;
  return session;
}
