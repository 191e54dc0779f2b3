import { Router } from 'express';
import { noSuch } from './api-error';
import type { Customer } from './api-objects';
import { applyCustomerParams } from './customer-params';
import { changedAttributes, recordEvent } from './event-log';
import { optionalString, rejectUnknownParams } from './form-params';
import { createdFilter, listPage } from './list-page';
import { newObjectId, unixNow } from './object-id';
import type { PaymentsContext } from './payments-context';
import { presentObject, requestExpand, requestParams } from './present-object';
import { expandObject } from './expand-fields';

const WRITABLE = [
  'address',
  'description',
  'email',
  'metadata',
  'name',
  'phone',
  'preferred_locales',
];

/**
 * Customers: `POST /v1/customers`, `GET /v1/customers/:id`, `POST /v1/customers/:id`,
 * `DELETE /v1/customers/:id`, `GET /v1/customers` (filters `email` — exact and case-sensitive,
 * as documented — and `created`). Events customer.created / .updated / .deleted.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 * @example router.use(customersRouter(context))
 */
export function customersRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.post('/customers', (request, response) => {
    const body = requestParams(request);
    rejectUnknownParams(body, WRITABLE);
    const customer = store.mutate(() => {
      const created: Customer = applyCustomerParams(
        {
          id: newObjectId('cus', 14),
          object: 'customer',
          address: null,
          balance: 0,
          created: unixNow(),
          currency: null,
          default_source: null,
          delinquent: false,
          description: null,
          email: null,
          invoice_prefix: newObjectId('x', 8).slice(2).toUpperCase(),
          livemode: false,
          metadata: {},
          name: null,
          phone: null,
          preferred_locales: [],
          shipping: null,
          tax_exempt: 'none',
          test_clock: null,
        },
        body,
      );
      store.state.customers[created.id] = created;
      recordEvent(context, 'customer.created', created);
      return created;
    });
    response.json(presentObject(context, request, customer));
  });

  router.get('/customers/:id', (request, response) => {
    response.json(
      presentObject(context, request, findCustomer(context, String(request.params['id']))),
    );
  });

  router.post('/customers/:id', (request, response) => {
    const body = requestParams(request);
    rejectUnknownParams(body, WRITABLE);
    const before = findCustomer(context, String(request.params['id']));
    const updated = store.mutate((state) => {
      const after = applyCustomerParams(structuredClone(before), body);
      state.customers[after.id] = after;
      const previous = changedAttributes(before, after);
      if (Object.keys(previous).length) recordEvent(context, 'customer.updated', after, previous);
      return after;
    });
    response.json(presentObject(context, request, updated));
  });

  router.delete('/customers/:id', (request, response) => {
    const customer = findCustomer(context, String(request.params['id']));
    store.mutate((state) => {
      delete state.customers[customer.id];
      recordEvent(context, 'customer.deleted', customer);
    });
    response.json({ id: customer.id, object: 'customer', deleted: true });
  });

  router.get('/customers', (request, response) => {
    const query = requestParams(request);
    const email = optionalString(query, 'email');
    const inRange = createdFilter(query);
    const matches = Object.values(store.state.customers)
      .reverse()
      .filter(
        (customer) =>
          (email === undefined || customer.email === email) && inRange(customer.created),
      );
    const expand = requestExpand(request);
    response.json(
      expandObject(
        store.state,
        listPage(matches, query, '/v1/customers', (customer) => customer),
        expand,
      ),
    );
  });

  return router;
}

function findCustomer(context: PaymentsContext, id: string): Customer {
  const customer = context.store.state.customers[id];
  if (!customer) throw noSuch('customer', id);
  return customer;
}
