/**
 * Server configuration, read once from the environment. Every value has a development default
 * that keeps the product on 127.0.0.1; production deployments set the variables explicitly.
 */
import path from 'node:path';
import { projectRoot } from './project-root';
import { wholeNumberSetting } from './whole-number-setting';

export interface Config {
  env: 'development' | 'test' | 'production';
  port: number;
  host: string;
  publicUrl: string;
  databaseUrl: string;
  /** Connections this process keeps to PostgreSQL at most (SIDECHECK_DB_POOL_SIZE). */
  databasePoolSize: number;
  dataDir: string;
  jwtSecret: string;
  accessTokenTtlSeconds: number;
  refreshTokenTtlSeconds: number;
  keyEncryptionSecret: string;
  /** `retryDelaySeconds`: first delay before a failed e-mail is tried again (doubling after each failure, pg-boss backoff). */
  smtp: { host: string; port: number; from: string; retryDelaySeconds?: number };
  payments: { secretKey: string; host: string; port: number; protocol: 'http' | 'https'; webhookSecret: string };
  clientDistDir: string;
  secureCookies: boolean;
}

function required(name: string, fallback?: string): string {
  const value = process.env[name] ?? fallback;
  if (value === undefined || value === '') {
    throw new Error(`config: environment variable ${name} is required`);
  }
  return value;
}

const integer = (name: string, fallback: number): number => wholeNumberSetting(process.env, name, fallback, { min: 0 });

export function loadConfig(): Config {
  const env = (process.env.NODE_ENV ?? 'development') as Config['env'];
  const port = integer('PORT', 4610);
  const root = projectRoot();
  const production = env === 'production';
  // Development and tests get fixed, clearly marked secrets; production must supply its own.
  const devSecret = (what: string) => (production ? undefined : `sidecheck-development-only-${what}`);
  return {
    env,
    port,
    host: process.env.HOST ?? '127.0.0.1',
    publicUrl: process.env.PUBLIC_URL ?? `http://127.0.0.1:${port}`,
    databaseUrl: required('DATABASE_URL'),
    // Few connections serve more: a request holds one only for its transaction's round trips, and
    // PostgreSQL backends beyond about twice the cores only contend for them (PostgreSQL wiki,
    // "Number Of Database Connections": (cores x 2) + spindles; from memory). On this 2-core
    // machine two API processes with 5 each cut the p99 at 300 req/s to a quarter of that with 20 each
    // (bench/load.ts --rate-only, DEVELOPERS.md "Connections to PostgreSQL").
    databasePoolSize: wholeNumberSetting(process.env, 'SIDECHECK_DB_POOL_SIZE', 5, { min: 1, max: 100 }),
    dataDir: process.env.SIDECHECK_DATA_DIR ?? path.join(root, '.data', 'files'),
    jwtSecret: required('JWT_SECRET', devSecret('jwt')),
    accessTokenTtlSeconds: integer('ACCESS_TOKEN_TTL_SECONDS', 600),
    refreshTokenTtlSeconds: integer('REFRESH_TOKEN_TTL_SECONDS', 14 * 24 * 3600),
    keyEncryptionSecret: required('KEY_ENCRYPTION_SECRET', devSecret('signing-keys')),
    smtp: {
      host: process.env.SMTP_HOST ?? '127.0.0.1',
      port: integer('SMTP_PORT', 4625),
      from: process.env.MAIL_FROM ?? 'Sidecheck <no-reply@sidecheck.test>',
      retryDelaySeconds: integer('SIDECHECK_MAIL_RETRY_DELAY_SECONDS', 5),
    },
    payments: {
      secretKey: required('PAYMENTS_SECRET_KEY', devSecret('payments') && 'sk_test_sidecheck_local'),
      host: process.env.PAYMENTS_HOST ?? '127.0.0.1',
      port: integer('PAYMENTS_PORT', 4627),
      protocol: (process.env.PAYMENTS_PROTOCOL as 'http' | 'https') ?? 'http',
      webhookSecret: required('PAYMENTS_WEBHOOK_SECRET', devSecret('webhook') && 'whsec_sidecheck_local'),
    },
    clientDistDir: process.env.CLIENT_DIST_DIR ?? path.join(root, 'dist', 'client', 'browser'),
    secureCookies: production || process.env.SECURE_COOKIES === 'true',
  };
}
