import { Router } from 'express';
import { noSuch } from './api-error';
import { optionalArray, optionalString } from './form-params';
import { createdFilter, listPage } from './list-page';
import type { PaymentsContext } from './payments-context';
import { requestParams } from './present-object';

/**
 * Events: `GET /v1/events/:id` and `GET /v1/events`, newest first, filters `type` (a trailing
 * `*` matches a prefix, e.g. 'charge.*', as documented), `types[]` and `created`.
 *
 * @param context - the stand-in context.
 * @returns a router to mount under /v1.
 */
export function eventsRouter(context: PaymentsContext): Router {
  const router = Router();
  const { store } = context;

  router.get('/events/:id', (request, response) => {
    const id = String(request.params['id']);
    const event = store.state.events[id];
    if (!event) throw noSuch('event', id);
    response.json(event);
  });

  router.get('/events', (request, response) => {
    const query = requestParams(request);
    const type = optionalString(query, 'type');
    const types = optionalArray(query, 'types')?.map(String);
    const inRange = createdFilter(query);
    const matchesType = (eventType: string) =>
      (type === undefined ||
        (type.endsWith('*') ? eventType.startsWith(type.slice(0, -1)) : eventType === type)) &&
      (types === undefined || types.includes(eventType));
    const matches = Object.values(store.state.events)
      .reverse()
      .filter((event) => matchesType(event.type) && inRange(event.created));
    response.json(listPage(matches, query, '/v1/events', (event) => event));
  });

  return router;
}
