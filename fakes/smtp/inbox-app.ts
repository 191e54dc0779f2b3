import express, { type Express, type NextFunction, type Request, type Response } from 'express';
import { createInboxApi } from './inbox-api';
import { createInboxPages } from './inbox-pages';
import type { MessageStore } from './message-store';

/**
 * The HTTP side of the SMTP stand-in: inbox pages and JSON API, then a JSON 404 and an error
 * handler that logs and answers a generic 500 (no stack traces to the client).
 *
 * @param store - the message store shared with the SMTP server.
 * @returns an Express app; it does not listen.
 * @example http.createServer(createInboxApp(store))
 */
export function createInboxApp(store: MessageStore): Express {
  const app = express();
  app.disable('x-powered-by');
  app.use(createInboxPages(store));
  app.use(createInboxApi(store));
  app.use((_request: Request, response: Response) => {
    response.status(404).json({ error: 'not_found' });
  });
  app.use((error: unknown, request: Request, response: Response, _next: NextFunction) => {
    console.error(`[smtp stand-in] ${request.method} ${request.originalUrl} failed`, error);
    response.status(500).json({ error: 'internal_error' });
  });
  return app;
}
