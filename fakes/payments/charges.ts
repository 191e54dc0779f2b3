import { Router } from 'express';
import { noSuch } from './api-error';
import { expandObject } from './expand-fields';
import { optionalString } from './form-params';
import { createdFilter, listPage } from './list-page';
import type { PaymentsContext } from './payments-context';
import { presentObject, requestExpand, requestParams } from './present-object';

/**
 * Charges (read-only): `GET /v1/charges/:id` and `GET /v1/charges` (filters payment_intent,
 * customer, created). A charge carries `amount_refunded` and `refunded`; reach it from an intent
 * with `expand[]=latest_charge`.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 */
export function chargesRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.get('/charges/:id', (request, response) => {
    const id = String(request.params['id']);
    const charge = store.state.charges[id];
    if (!charge) throw noSuch('charge', id);
    response.json(presentObject(context, request, charge));
  });

  router.get('/charges', (request, response) => {
    const query = requestParams(request);
    const paymentIntent = optionalString(query, 'payment_intent');
    const customer = optionalString(query, 'customer');
    const inRange = createdFilter(query);
    const matches = Object.values(store.state.charges)
      .reverse()
      .filter(
        (charge) =>
          (paymentIntent === undefined || charge.payment_intent === paymentIntent) &&
          (customer === undefined || charge.customer === customer) &&
          inRange(charge.created),
      );
    const page = listPage(matches, query, '/v1/charges', (charge) => charge);
    response.json(expandObject(store.state, page, requestExpand(request)));
  });

  return router;
}
