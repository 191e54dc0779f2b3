import { Router, type Request, type Response } from 'express';
import type { MessageStore } from './message-store';
import { toMessageDetailJson, toMessageJson } from './message-json';
import { requestOrigin } from './request-origin';
import type { StoredMessage } from './stored-message';

/**
 * JSON API over the received mail, for tests and tools:
 * `GET /api/messages?to=addr` (newest first), `GET /api/messages/:id`, `GET …/:id/raw`,
 * `GET …/:id/attachments/:index`, `DELETE /api/messages`, `DELETE /api/messages/:id`.
 * Unknown ids answer 404 `{ error: 'message_not_found' }`.
 *
 * @param store - the message store the SMTP side writes into.
 * @returns an Express router to mount at the root.
 * @example app.use(createInboxApi(store))
 */
export function createInboxApi(store: MessageStore): Router {
  const router = Router();

  router.get('/api/messages', (request, response) => {
    const to = typeof request.query['to'] === 'string' ? request.query['to'] : undefined;
    const origin = requestOrigin(request);
    response.json(store.list({ to }).map((message) => toMessageJson(message, origin)));
  });

  router.get('/api/messages/:id', (request, response) => {
    const message = findOr404(store, request, response);
    if (message) response.json(toMessageDetailJson(message, requestOrigin(request)));
  });

  router.get('/api/messages/:id/raw', (request, response) => {
    const message = findOr404(store, request, response);
    if (message) response.type('message/rfc822').send(message.raw);
  });

  router.get('/api/messages/:id/attachments/:index', (request, response) => {
    const message = findOr404(store, request, response);
    if (!message) return;
    const attachment = message.parsed.attachments[Number(request.params['index'])];
    if (!/^[0-9]+$/.test(String(request.params['index'])) || !attachment) {
      response.status(404).json({ error: 'attachment_not_found' });
      return;
    }
    response.attachment(attachment.filename ?? `attachment-${String(request.params['index'])}`);
    // The sender's declared type, not one guessed from the file name; never sniffed.
    response.set('Content-Type', attachment.contentType).set('X-Content-Type-Options', 'nosniff');
    response.send(attachment.content);
  });

  router.delete('/api/messages', async (_request, response) => {
    await store.clear();
    response.status(204).end();
  });

  router.delete('/api/messages/:id', async (request, response) => {
    const removed = await store.remove(String(request.params['id']));
    if (removed) response.status(204).end();
    else response.status(404).json({ error: 'message_not_found' });
  });

  return router;
}

function findOr404(
  store: MessageStore,
  request: Request,
  response: Response,
): StoredMessage | undefined {
  const message = store.get(String(request.params['id']));
  if (!message) response.status(404).json({ error: 'message_not_found' });
  return message;
}
