import express, { type Express, type RequestHandler } from 'express';
import { PAYMENTS_API_VERSION } from './api-version';
import { chargesRouter } from './charges';
import { checkoutSessionsRouter } from './checkout-sessions';
import { customersRouter } from './customers';
import { apiErrorMiddleware, unknownApiRoute } from './error-middleware';
import { eventsRouter } from './events';
import { hostedPageRouter } from './hosted-page';
import { idempotency } from './idempotency';
import { newObjectId } from './object-id';
import { paymentIntentsRouter } from './payment-intents';
import type { PaymentsContext } from './payments-context';
import { refundsRouter } from './refunds';
import { secretKeyAuth } from './secret-key-auth';
import { testControlsRouter } from './test-controls';
import type { WebhookDeliveryWorker } from './webhook-delivery';

/** Every API response carries a request id and the API version, as the real API's do. */
const apiResponseHeaders: RequestHandler = (_request, response, next) => {
  response.set('Request-Id', newObjectId('req', 14)).set('Stripe-Version', PAYMENTS_API_VERSION);
  next();
};

/**
 * Builds the payments stand-in's HTTP app (it does not listen):
 * `/v1/*` the API subset (secret key, form bodies in qs "extended" syntax — nested brackets,
 * string leaves — and Idempotency-Key handling), `/pay/*` the hosted payment page (no key: the
 * buyer's browser), `/_control/*` test controls (secret key).
 *
 * @param context - the stand-in context.
 * @param worker - the webhook delivery worker (for the test controls).
 * @returns the Express app.
 * @example http.createServer(createPaymentsApp(context, worker))
 */
export function createPaymentsApp(
  context: PaymentsContext,
  worker: WebhookDeliveryWorker,
): Express {
  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'extended'); // the SDK sends expand[0]=… and created[gte]=… in queries
  app.set('etag', false);
  const forms = express.urlencoded({ extended: true, limit: '1mb' });
  const auth = secretKeyAuth(context.secretKey);

  const api = express.Router();
  api.use(apiResponseHeaders, auth, forms, idempotency(context.store));
  api.use(customersRouter(context));
  api.use(checkoutSessionsRouter(context));
  api.use(paymentIntentsRouter(context));
  api.use(chargesRouter(context));
  api.use(refundsRouter(context));
  api.use(eventsRouter(context));
  api.use(unknownApiRoute);
  app.use('/v1', api);

  app.use('/pay', forms, hostedPageRouter(context));
  app.use('/_control', auth, express.json(), testControlsRouter(context, worker));
  app.use(unknownApiRoute);
  app.use(apiErrorMiddleware);
  return app;
}
