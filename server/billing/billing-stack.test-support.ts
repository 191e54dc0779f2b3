/**
 * Test support (not used in production): the real app on the test database, listening on an
 * ephemeral loopback port so the payment stand-in (fakes/payments, started through its fixture)
 * can deliver signed webhooks to it, with the SDK of the app pointed at that stand-in.
 *
 * `closeWebhookGate()` makes the endpoint answer 503 for a while, so a test can hold deliveries
 * back and then hand them over in an order of its choosing with the stand-in's replay control.
 */
import { createServer, type RequestListener } from 'node:http';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { signIn } from '../../test/support/factories';
import { closeHttpServer, listenOnLoopback } from '../../fakes/loopback-listen';
import { startPaymentsFixture, TEST_SECRET_KEY, TEST_WEBHOOK_SECRET, type PaymentsFixture } from '../../fakes/payments/payments-fixture';
import { asSystem } from '../tenancy/tenant-transaction';

export interface BillingStack {
  t: TestApp;
  payments: PaymentsFixture;
  /** Base URL the stand-in delivers webhooks to. */
  appUrl: string;
  closeWebhookGate(): void;
  openWebhookGate(): void;
  /** Call a stand-in test control (POST /_control/...), with the secret key. */
  control(method: 'GET' | 'POST', path: string): Promise<unknown>;
  close(): Promise<void>;
}

export async function startBillingStack(): Promise<BillingStack> {
  let gateOpen = true;
  let app: RequestListener | null = null;
  const server = createServer((req, res) => {
    if (!app || !gateOpen) {
      res.statusCode = 503;
      res.end();
      return;
    }
    app(req, res);
  });
  const port = await listenOnLoopback(server, 0);
  const appUrl = `http://127.0.0.1:${port}`;
  // A long first retry delay: a delivery the gate refused waits for the test to hand it over.
  const payments = await startPaymentsFixture({ webhookUrl: `${appUrl}/api/billing/webhook`, webhookSecret: TEST_WEBHOOK_SECRET, retryBaseMs: 60_000 });
  const t = await startTestApp({ payments: { port: payments.standIn.port, secretKey: TEST_SECRET_KEY, webhookSecret: TEST_WEBHOOK_SECRET } });
  app = t.app as unknown as RequestListener;
  return {
    t,
    payments,
    appUrl,
    closeWebhookGate: () => void (gateOpen = false),
    openWebhookGate: () => void (gateOpen = true),
    async control(method, path) {
      const res = await fetch(`${payments.baseUrl}/_control${path}`, { method, headers: { Authorization: `Bearer ${TEST_SECRET_KEY}` } });
      if (!res.ok) throw new Error(`control ${method} ${path}: ${res.status} ${await res.text()}`);
      return res.json();
    },
    async close() {
      await payments.close();
      await closeHttpServer(server);
      await t.close();
    },
  };
}

/** A request function for one person in one organization, over supertest on the app. */
export async function actingAs(t: TestApp, user: { email: string }, organizationId: string, password?: string) {
  const { token } = await signIn(t.app, user.email, password);
  return (method: 'get' | 'post' | 'put', path: string, body?: object) => {
    const r = request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', organizationId);
    return body ? r.send(body) : r;
  };
}

/** Balance and ledger rows of (lab, client), read in system scope so the test sees the truth. */
export async function ledgerOf(t: TestApp, labId: string, clientId: string) {
  return asSystem(t.sequelize, async () => {
    const rows = await t.sequelize.query<{ kind: string; credits: number; report_id: string | null; provider_event_id: string | null }>(
      'SELECT kind, credits, report_id, provider_event_id FROM credit_ledger WHERE organization_id = :labId AND client_id = :clientId ORDER BY created_at, id',
      { replacements: { labId, clientId }, type: QueryTypes.SELECT },
    );
    return { rows, balance: rows.reduce((sum, r) => sum + r.credits, 0) };
  });
}

/** Mail jobs in the pg-boss queue whose subject contains `subjectPart`. */
export async function mailJobs(t: TestApp, subjectPart: string) {
  return t.sequelize.query<{ data: { to: string; subject: string; text: string; attachments?: { filename: string; contentBase64: string }[] } }>(
    `SELECT data FROM pgboss.job WHERE name = 'mail' AND data->>'subject' LIKE :subject`,
    { replacements: { subject: `%${subjectPart.replace(/[%_\\]/g, '\\$&')}%` }, type: QueryTypes.SELECT },
  );
}

/** Poll `check` every 50 ms until it returns a value that is not undefined, or fail after `timeoutMs`. */
export async function eventually<T>(what: string, check: () => Promise<T | undefined>, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`eventually: ${what} did not happen within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
