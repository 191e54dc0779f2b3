import { Router, type Response } from 'express';
import { replaceCidLinks } from './cid-links';
import { INBOX_CSS } from './inbox-css';
import { inboxLayout, renderInboxPage, renderMessagePage } from './inbox-html';
import type { MessageStore } from './message-store';
import { toMessageDetailJson, toMessageJson } from './message-json';
import { requestOrigin } from './request-origin';

/** Our pages load only our own style sheet and frame only our own HTML-body URL. */
const PAGE_CSP =
  "default-src 'none'; style-src 'self'; img-src 'self'; frame-src 'self'; form-action 'self'; base-uri 'none'";
/**
 * A mail's HTML runs in a sandbox (no scripts, opaque origin) and may load only inline styles and
 * our attachment URLs, so opening a message never fetches anything from the network.
 */
const MAIL_BODY_CSP =
  "sandbox; default-src 'none'; style-src 'unsafe-inline'; img-src 'self' data:";

/**
 * Human-facing inbox: `GET /` (list, `?to=` filter), `GET /messages/:id`, `GET /messages/:id/html`
 * (the HTML part alone, for the sandboxed iframe), `POST /messages/delete`, `GET /inbox.css`.
 *
 * @param store - the message store.
 * @returns an Express router to mount at the root.
 * @example app.use(createInboxPages(store))
 */
export function createInboxPages(store: MessageStore): Router {
  const router = Router();

  router.get('/inbox.css', (_request, response) => {
    response.type('text/css').send(INBOX_CSS);
  });

  router.get('/', (request, response) => {
    const to = typeof request.query['to'] === 'string' ? request.query['to'] : '';
    const origin = requestOrigin(request);
    const messages = store
      .list({ to: to || undefined })
      .map((message) => toMessageJson(message, origin));
    sendPage(response, 200, renderInboxPage(messages, to));
  });

  router.get('/messages/:id', (request, response) => {
    const message = store.get(String(request.params['id']));
    if (!message) return sendNotFound(response);
    sendPage(
      response,
      200,
      renderMessagePage(toMessageDetailJson(message, requestOrigin(request))),
    );
  });

  router.get('/messages/:id/html', (request, response) => {
    const message = store.get(String(request.params['id']));
    if (!message || !message.parsed.html) return sendNotFound(response);
    const html = replaceCidLinks(
      message.parsed.html,
      message.parsed.attachments,
      (index) => `/api/messages/${message.id}/attachments/${index}`,
    );
    response.set('Content-Security-Policy', MAIL_BODY_CSP).type('html').send(html);
  });

  router.post('/messages/delete', async (_request, response) => {
    await store.clear();
    response.redirect(303, '/');
  });

  return router;
}

function sendPage(response: Response, status: number, html: string): void {
  response.status(status).set('Content-Security-Policy', PAGE_CSP).type('html').send(html);
}

function sendNotFound(response: Response): void {
  sendPage(
    response,
    404,
    inboxLayout('Not found', '<h1>No such message</h1><p><a href="/">Back</a></p>'),
  );
}
