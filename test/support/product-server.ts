/**
 * The compiled API server (dist/server/server/main.js) as a child process for fault tests, and a
 * small HTTP client that signs a person in and calls the API the way the browser does.
 */
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { startNode, waitForHttp, type Started } from './processes';

export interface ServerOptions {
  port: number;
  databaseUrl: string;
  /** Where the stand-ins listen; by default ports nothing listens on (mail then waits in the queue). */
  smtpPort?: number;
  paymentsPort?: number;
  dataDir?: string;
  env?: Record<string, string>;
}

export interface ProductServer extends Started {
  base: string;
  env: Record<string, string>;
}

/** The environment the server runs with (the stand-ins take the same variables). */
export function serverEnv(options: ServerOptions): Record<string, string> {
  const base = `http://127.0.0.1:${options.port}`;
  return {
    NODE_ENV: 'test',
    DATABASE_URL: options.databaseUrl,
    PORT: String(options.port),
    PUBLIC_URL: base,
    SMTP_PORT: String(options.smtpPort ?? 9),
    PAYMENTS_PORT: String(options.paymentsPort ?? 9),
    PAYMENTS_SECRET_KEY: 'sk_test_sidecheck_local',
    PAYMENTS_WEBHOOK_SECRET: 'whsec_sidecheck_local',
    PAYMENTS_WEBHOOK_URL: `${base}/api/billing/webhook`,
    SIDECHECK_DATA_DIR: options.dataDir ?? fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-faults-files-')),
    ...options.env,
  };
}

/** Starts the server and waits until /api/health answers 200. */
export async function startServer(options: ServerOptions, name = 'server'): Promise<ProductServer> {
  const env = serverEnv(options);
  const started = startNode('dist/server/server/main.js', env, name);
  await waitForHttp(`${env.PUBLIC_URL}/api/health`, started);
  return { ...started, base: env.PUBLIC_URL, env };
}

/** Kills a child process with SIGKILL (no shutdown handler runs) and waits until it is gone. */
export function killHard(started: Started): Promise<void> {
  return new Promise((resolve) => {
    if (started.process.exitCode !== null || started.process.signalCode !== null) return resolve();
    started.process.once('exit', () => resolve());
    started.process.kill('SIGKILL');
  });
}

export interface ApiAnswer<T = any> {
  status: number;
  headers: Headers;
  body: T;
  bytes: Buffer;
}

export type Api = <T = any>(method: string, url: string, body?: unknown, options?: { timeoutMs?: number }) => Promise<ApiAnswer<T>>;

/** One HTTP call; JSON bodies are parsed, anything else is left as bytes. Never throws for a status. */
export async function call<T = any>(base: string, method: string, url: string, options: { body?: unknown; headers?: Record<string, string>; timeoutMs?: number } = {}): Promise<ApiAnswer<T>> {
  const isForm = options.body instanceof FormData;
  const res = await fetch(`${base}/api${url}`, {
    method,
    headers: { ...(options.body !== undefined && !isForm ? { 'content-type': 'application/json' } : {}), ...options.headers },
    body: options.body === undefined ? undefined : isForm ? (options.body as FormData) : JSON.stringify(options.body),
    signal: AbortSignal.timeout(options.timeoutMs ?? 30_000),
  });
  const bytes = Buffer.from(await res.arrayBuffer());
  const type = res.headers.get('content-type') ?? '';
  const body = /json/.test(type) && bytes.length ? JSON.parse(bytes.toString('utf8')) : undefined;
  return { status: res.status, headers: res.headers, body: body as T, bytes };
}

/** Signs `email` in and answers a caller acting in `organizationId` (default: the first membership). */
export async function signedIn(base: string, email: string, password: string, organizationId?: string): Promise<Api> {
  const session = await call<{ accessToken: string; user: { memberships: { organizationId: string }[] } }>(base, 'POST', '/auth/sign-in', { body: { email, password } });
  if (session.status !== 200) throw new Error(`sign-in of ${email} failed: ${session.status} ${session.bytes.toString()}`);
  const org = organizationId ?? session.body.user.memberships[0].organizationId;
  const headers = { authorization: `Bearer ${session.body.accessToken}`, 'x-organization-id': org };
  return (method, url, body, options) => call(base, method, url, { body, headers, timeoutMs: options?.timeoutMs });
}

/** Polls `check` every 200 ms until it answers something other than undefined, or fails after `timeoutMs`. */
export async function waitFor<T>(what: string, check: () => Promise<T | undefined>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}
