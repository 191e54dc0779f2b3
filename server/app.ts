/** Builds the Express application; never listens (main.ts does, tests use supertest on it). */
import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import helmet from 'helmet';
import cookieParser from 'cookie-parser';
import type { Sequelize } from 'sequelize';
import { configurePassport, identify } from './auth/passport';
import { identifyApiKey } from './api-keys/identify-api-key';
import { apiNotFound, errorHandler } from './http/error-handler';
import { buildRouter } from './http/router';
import { routeTable, type RouteTableDeps } from './route-table';

export interface AppDeps extends Omit<RouteTableDeps, 'sequelize'> {
  sequelize: Sequelize;
  clientDistDir?: string;
  log?: (entry: Record<string, unknown>) => void;
}

export function buildApp(deps: AppDeps): express.Express {
  const log = deps.log ?? ((entry) => console.error(JSON.stringify(entry)));
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.set('query parser', 'simple');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"], // Angular Material sets inline styles on elements
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'"],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  const passport = configurePassport(deps.tokens.secret);
  // API answers are a lab's records: never kept by a browser or a proxy (OWASP's guidance for
  // sensitive data), so no ETag either; Express would otherwise hash every body for one.
  app.set('etag', false);
  const api = express.Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // The payment webhook's signature covers the exact bytes: keep its body raw (json then skips it).
  api.use('/billing/webhook', express.raw({ type: () => true, limit: '1mb' }));
  api.use(express.json({ limit: '1mb' }));
  api.use(cookieParser());
  api.use(identifyApiKey(deps.sequelize));
  api.use(identify(passport));
  api.use(buildRouter(deps.sequelize, routeTable(deps)));
  api.use(apiNotFound);
  app.use('/api', api);

  if (deps.clientDistDir && fs.existsSync(path.join(deps.clientDistDir, 'index.html'))) {
    const dist = deps.clientDistDir;
    app.use(express.static(dist, { index: false, maxAge: '1h', setHeaders: (res, file) => file.endsWith('.html') && res.setHeader('Cache-Control', 'no-cache') }));
    // Client-side routes (sign-in, /verify/<token>, ...) all load the app shell.
    app.get('/{*splat}', (_req, res) => res.setHeader('Cache-Control', 'no-cache').sendFile(path.join(dist, 'index.html')));
  }
  app.use(errorHandler(log));
  return app;
}
