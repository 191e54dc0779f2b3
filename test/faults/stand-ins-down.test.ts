/**
 * Faults of the hosted services, with the compiled server and the stand-ins (fakes/) as processes:
 * - the SMTP stand-in is down while a report is issued: the report is issued, its e-mail waits in
 *   the job queue (retried), and arrives once the stand-in is back;
 * - the payment stand-in is down: checkout answers a clear 503 problem and stores nothing;
 * - our server is down when the payment stand-in delivers the paid checkout's webhook: the
 *   stand-in retries with backoff (fakes/payments/webhook-delivery.ts) until our restarted server
 *   acknowledges it, and the pack is credited exactly once, a replay included.
 * Mail and payments run as two stand-in processes so each can be stopped alone. The database is
 * a private cluster, so the mail queue holds only this test's jobs.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { asSystem } from '../../server/tenancy/tenant-transaction';
import { payOnHostedPage } from '../../fakes/payments/hosted-page-client';
import { buildLabScenario, TEST_PASSWORD } from '../support/factories';
import { approvedRun } from '../support/approved-run';
import { createPrivateCluster, prepareDatabase, type PrivateCluster } from '../support/private-cluster';
import { startNode, waitForHttp, type Started } from '../support/processes';
import { signedIn, startServer, waitFor, type Api, type ProductServer, type ServerOptions } from '../support/product-server';

jest.setTimeout(120_000);

const PORT = 5022;
const SMTP_PORT = 5023;
const INBOX = 'http://127.0.0.1:5024';
const PAYMENTS_PORT = 5025;
const PG_PORT = 54632;
const SECRET_KEY = 'sk_test_sidecheck_local';
const fakesDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-standins-'));

let cluster: PrivateCluster;
let sequelize: Sequelize;
let server: ProductServer;
let mail: Started | null = null;
let payments: Started | null = null;
let s: Awaited<ReturnType<typeof buildLabScenario>>;
let serverOptions: ServerOptions;
let engineer: Api;
let reviewer: Api;
let maker: Api;

/** The mail stand-in alone (its payment side listens on a port nobody uses). */
async function startMail(): Promise<Started> {
  const started = startNode('dist/server/fakes/main.js', { SMTP_PORT: String(SMTP_PORT), SMTP_HTTP_PORT: '5024', PAYMENTS_PORT: '5026', PAYMENTS_SECRET_KEY: SECRET_KEY, FAKES_DATA_DIR: path.join(fakesDir, 'mail-side') }, 'mail stand-in');
  await waitForHttp(`${INBOX}/api/messages`, started);
  return started;
}

/** The payment stand-in alone, delivering webhooks to our server (its mail side unused). */
async function startPayments(): Promise<Started> {
  const started = startNode('dist/server/fakes/main.js', {
    SMTP_PORT: '5027',
    SMTP_HTTP_PORT: '5028',
    PAYMENTS_PORT: String(PAYMENTS_PORT),
    PAYMENTS_SECRET_KEY: SECRET_KEY,
    PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${PORT}/api/billing/webhook`,
    PAYMENTS_WEBHOOK_SECRET: 'whsec_sidecheck_local',
    FAKES_DATA_DIR: path.join(fakesDir, 'payments-side'),
  }, 'payments stand-in');
  await waitFor('the payment stand-in', async () => {
    const res = await fetch(`http://127.0.0.1:${PAYMENTS_PORT}/_control/deliveries`, { headers: { authorization: `Bearer ${SECRET_KEY}` } }).catch(() => null);
    if (started.process.exitCode !== null) throw new Error(started.output());
    return res?.ok ? true : undefined;
  });
  return started;
}

const q = <T extends object>(sql: string, replacements: Record<string, unknown> = {}) =>
  asSystem(sequelize, (transaction) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction }));

beforeAll(async () => {
  cluster = await createPrivateCluster('pg-faults-standins', PG_PORT);
  await prepareDatabase(cluster.url);
  sequelize = createSequelize(cluster.url, { poolMax: 2 });
  initModels(sequelize);
  s = await buildLabScenario(sequelize);
  [mail, payments] = await Promise.all([startMail(), startPayments()]);
  // A failed e-mail is tried again after 1 s, doubling (SIDECHECK_MAIL_RETRY_DELAY_SECONDS; 5 s by default).
  serverOptions = { port: PORT, databaseUrl: cluster.url, smtpPort: SMTP_PORT, paymentsPort: PAYMENTS_PORT, env: { SIDECHECK_MAIL_RETRY_DELAY_SECONDS: '1' } };
  server = await startServer(serverOptions);
  const billing = await signedIn(server.base, s.billing.email, TEST_PASSWORD, s.lab.id);
  // Invented prices (GBP 800.00 for 5 credits, in pence), and enough credits for the reports here.
  expect((await billing('PUT', '/billing/price-list', { currency: 'GBP', packs: [{ credits: 5, priceMinor: 80_000 }] })).status).toBe(200);
  expect((await billing('POST', '/billing/adjustments', { clientId: s.client.id, credits: 3, reason: 'Fault test opening balance' })).status).toBe(201);
  engineer = await signedIn(server.base, s.engineer.email, TEST_PASSWORD, s.lab.id);
  reviewer = await signedIn(server.base, s.reviewer.email, TEST_PASSWORD, s.lab.id);
  maker = await signedIn(server.base, s.makerAdmin.email, TEST_PASSWORD, s.maker.id);
});

afterAll(async () => {
  await server?.stop();
  await mail?.stop();
  await payments?.stop();
  await sequelize?.close();
  await cluster?.destroy();
  fs.rmSync(fakesDir, { recursive: true, force: true });
});

async function inbox(to: string): Promise<{ subject: string; text: string }[]> {
  const res = await fetch(`${INBOX}/api/messages?to=${encodeURIComponent(to)}`);
  const list = (await res.json()) as { subject: string; text: string }[] | { messages: { subject: string; text: string }[] };
  return Array.isArray(list) ? list : list.messages;
}

test('SMTP stand-in down during an issue: the report is issued, and its e-mail arrives after the stand-in is back', async () => {
  await mail!.stop();
  mail = null;
  const run = await approvedRun(engineer, reviewer, s.plan.id);
  const issued = await reviewer('POST', `/runs/${run.id}/issue`);
  expect(issued.status).toBe(201);
  const subject = `Test report ${issued.body.reportNumber} %`;
  // The delivery was tried and failed: the job waits for its retry, nothing is lost.
  const failed = await waitFor('a failed delivery attempt of the report e-mail', async () => {
    const rows = await q<{ state: string; output: unknown }>(`SELECT state, output FROM pgboss.job WHERE name = 'mail' AND data->>'subject' LIKE :subject`, { subject });
    return rows.length === 1 && rows[0].state === 'retry' ? rows[0] : undefined;
  });
  // pg-boss keeps the handler's error as the job's output: the refused SMTP connection.
  expect(JSON.stringify(failed.output)).toMatch(/ECONNREFUSED/);
  expect((await reviewer('GET', `/runs/${run.id}`)).body.state).toBe('issued');

  mail = await startMail();
  const t0 = Date.now();
  const message = await waitFor('the report e-mail in the inbox', async () => (await inbox(s.client.contactEmail)).find((m) => m.subject.includes(issued.body.reportNumber)), 30_000);
  console.log(`report e-mail delivered ${Date.now() - t0} ms after the SMTP stand-in came back `);
  expect(message.text).toContain(`${server.base}/verify/`);
  const done = await waitFor('the mail job to complete', async () => {
    const rows = await q<{ state: string }>(`SELECT state FROM pgboss.job WHERE name = 'mail' AND data->>'subject' LIKE :subject UNION ALL SELECT state FROM pgboss.archive WHERE name = 'mail' AND data->>'subject' LIKE :subject`, { subject });
    return rows.length === 1 && rows[0].state === 'completed' ? rows : undefined;
  });
  expect(done).toHaveLength(1);
  // Delivered once, not once per attempt.
  expect((await inbox(s.client.contactEmail)).filter((m) => m.subject.includes(issued.body.reportNumber))).toHaveLength(1);
});

test('payment stand-in down: checkout answers 503 problem+json and stores nothing', async () => {
  await payments!.stop();
  payments = null;
  const before = await q<{ purchases: number; customers: number; audits: number }>(
    `SELECT (SELECT count(*)::int FROM credit_purchases WHERE buyer_organization_id = :maker) AS purchases,
            (SELECT count(*)::int FROM payment_customers WHERE organization_id = :maker) AS customers,
            (SELECT count(*)::int FROM audit_log WHERE action = 'credit-checkout' AND organization_id = :maker) AS audits`,
    { maker: s.maker.id },
  );
  const t0 = Date.now();
  const res = await maker('POST', '/billing/checkout', { labId: s.lab.id, packId: 'pack-5' });
  const ms = Date.now() - t0;
  console.log(`checkout with the payment stand-in down answered ${res.status} in ${ms} ms`);
  expect(res.status).toBe(503);
  expect(res.headers.get('content-type')).toMatch(/^application\/problem\+json/);
  expect(res.headers.get('retry-after')).toMatch(/^\d+$/);
  expect(res.body).toMatchObject({ status: 503, code: 'service-unavailable', detail: expect.stringMatching(/nothing was charged/) });
  const after = await q<{ purchases: number; customers: number; audits: number }>(
    `SELECT (SELECT count(*)::int FROM credit_purchases WHERE buyer_organization_id = :maker) AS purchases,
            (SELECT count(*)::int FROM payment_customers WHERE organization_id = :maker) AS customers,
            (SELECT count(*)::int FROM audit_log WHERE action = 'credit-checkout' AND organization_id = :maker) AS audits`,
    { maker: s.maker.id },
  );
  expect(after).toEqual(before);
  expect((await maker('GET', '/billing/purchases')).body.items).toEqual([]);
});

test('a paid checkout whose webhook finds our server down is credited exactly once after it is back', async () => {
  payments ??= await startPayments();
  const checkout = await maker('POST', '/billing/checkout', { labId: s.lab.id, packId: 'pack-5' });
  expect(checkout.status).toBe(201);
  const { purchaseId, url } = checkout.body as { purchaseId: string; url: string };
  const balanceBefore = (await maker('GET', '/billing/balance')).body.totalCredits as number;

  await server.stop();
  // The buyer pays while our server is down; the stand-in's deliveries fail and are rescheduled.
  expect((await payOnHostedPage(url, { number: '4242 4242 4242 4242' })).status).toBe(303);
  const control = async () => {
    const res = await fetch(`http://127.0.0.1:${PAYMENTS_PORT}/_control/deliveries`, { headers: { authorization: `Bearer ${SECRET_KEY}` } });
    return (await res.json()) as { data: { eventId: string; deliveredAt: string | null; attempts: { status: number | null; error: string | null }[] }[] };
  };
  const completedEvent = async () => {
    const res = await fetch(`http://127.0.0.1:${PAYMENTS_PORT}/v1/events?type=checkout.session.completed`, { headers: { authorization: `Bearer ${SECRET_KEY}` } });
    const events = (await res.json()) as { data: { id: string; data: { object: { metadata: { purchaseId?: string } } } }[] };
    return events.data.find((e) => e.data.object.metadata.purchaseId === purchaseId)?.id;
  };
  const eventId = await waitFor('the checkout.session.completed event', completedEvent);
  await waitFor('a refused delivery of that event', async () => ((await control()).data.some((d) => d.eventId === eventId && d.attempts.length > 0 && !d.deliveredAt) ? true : undefined));
  expect((await q('SELECT id FROM credit_ledger WHERE purchase_id = :purchaseId', { purchaseId })).length).toBe(0);

  server = await startServer(serverOptions);
  const t0 = Date.now();
  const done = await waitFor('the purchase to complete', async () => {
    const p = await maker('GET', `/billing/purchases/${purchaseId}`);
    return p.body?.status === 'completed' ? p.body : undefined;
  }, 40_000);
  const delivery = (await control()).data.find((d) => d.eventId === eventId)!;
  console.log(`webhook delivered ${Date.now() - t0} ms after our server was back, on attempt ${delivery.attempts.length}: ${JSON.stringify(delivery.attempts.map((a) => a.status ?? a.error))}`);
  expect(done).toMatchObject({ credits: 5 });
  // Refused first (our server was down), then acknowledged.
  expect(delivery.attempts[0].status).not.toBe(200);
  expect(delivery.attempts[delivery.attempts.length - 1].status).toBe(200);

  // A second delivery of the same event changes nothing.
  const replay = await fetch(`http://127.0.0.1:${PAYMENTS_PORT}/_control/events/${eventId}/replay`, { method: 'POST', headers: { authorization: `Bearer ${SECRET_KEY}` } });
  expect(replay.status).toBe(200);
  const rows = await q<{ kind: string; credits: number }>('SELECT kind, credits FROM credit_ledger WHERE purchase_id = :purchaseId', { purchaseId });
  expect(rows).toEqual([{ kind: 'purchase', credits: 5 }]);
  expect((await maker('GET', '/billing/balance')).body.totalCredits).toBe(balanceBefore + 5);
});
