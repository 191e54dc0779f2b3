import { Router } from 'express';
import { noSuch } from './api-error';
import type { PaymentsContext } from './payments-context';
import type { WebhookDeliveryWorker } from './webhook-delivery';

/**
 * Test controls — not part of the payment API, hence outside /v1 under /_control, and guarded by
 * the same secret key:
 * - `POST /_control/events/:id/replay` delivers an event again to every endpoint, now;
 * - `POST /_control/deliver-pending` attempts every undelivered delivery now;
 * - `GET /_control/deliveries[?event=evt_…]` lists deliveries with all their attempts;
 * - `POST /_control/reset` forgets all objects, events and deliveries.
 *
 * @param context - the stand-in context.
 * @param worker - the webhook delivery worker.
 * @returns a router to mount at /_control.
 */
export function testControlsRouter(
  context: PaymentsContext,
  worker: WebhookDeliveryWorker,
): Router {
  const router = Router();
  const { store } = context;

  router.post('/events/:id/replay', async (request, response) => {
    const id = String(request.params['id']);
    if (!store.state.events[id]) throw noSuch('event', id);
    response.json({ event: id, deliveries: await worker.replay(id) });
  });

  router.post('/deliver-pending', async (_request, response) => {
    response.json(await worker.deliverPending());
  });

  router.get('/deliveries', (request, response) => {
    const eventId = typeof request.query['event'] === 'string' ? request.query['event'] : undefined;
    const data = Object.values(store.state.deliveries)
      .filter((delivery) => eventId === undefined || delivery.eventId === eventId)
      .reverse();
    response.json({ object: 'list', data, has_more: false, url: '/_control/deliveries' });
  });

  router.post('/reset', (_request, response) => {
    store.reset();
    response.json({ reset: true });
  });

  return router;
}
