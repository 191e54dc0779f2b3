/**
 * Fault: the API server is killed (SIGKILL, no shutdown handler) while it issues a report. Issuing
 * is one database transaction (server/reports/report-service.ts), so after a restart on the same
 * database the run must be issued completely — report row with its PDF whose SHA-256 matches the
 * stored hash and which carries a signature, its certificate, one credit consumption, run state
 * issued, the audit entry and the client's e-mail job — or not at all (no report, no credit taken,
 * no audit entry, no mail, run still approved), and issuing again must then work exactly once.
 *
 * A probe connection watches pg_stat_activity: once the issue's transaction is open, the kill
 * lands at a fraction of a measured issue time, or right after the transaction has ended (the
 * commit is done, the answer may not be sent). The probe records whether a transaction was open at
 * the instant of the kill, and at least one kill must land inside one.
 */
import crypto from 'node:crypto';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Client as PgClient } from 'pg';
import { QueryTypes, type Sequelize } from 'sequelize';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { migrateUp } from '../../server/db/migrate';
import { ensureBuiltInRuleSets } from '../../server/demo/seed';
import { asSystem } from '../../server/tenancy/tenant-transaction';
import { buildLabScenario, TEST_PASSWORD } from '../support/factories';
import { testDatabaseUrl } from '../support/test-app';
import { approvedRun } from '../support/approved-run';
import { killHard, signedIn, startServer, type Api, type ProductServer } from '../support/product-server';

jest.setTimeout(150_000);

const PORT = 5020;
const CREDITS = 20;
let sequelize: Sequelize;
let probe: PgClient;
let server: ProductServer;
let s: Awaited<ReturnType<typeof buildLabScenario>>;
let engineer: Api;
let reviewer: Api;
const pdfDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-kill-'));

const start = () => startServer({ port: PORT, databaseUrl: testDatabaseUrl() }, 'server');

beforeAll(async () => {
  sequelize = createSequelize(testDatabaseUrl(), { poolMax: 2 });
  initModels(sequelize);
  await migrateUp(sequelize);
  await ensureBuiltInRuleSets(sequelize);
  s = await buildLabScenario(sequelize);
  probe = new PgClient({ connectionString: testDatabaseUrl(), application_name: 'sidecheck-fault-probe' });
  await probe.connect();
  server = await start();
  const billing = await signedIn(server.base, s.billing.email, TEST_PASSWORD, s.lab.id);
  // Invented prices; the lab sells credits, so every issue takes one (server/billing).
  expect((await billing('PUT', '/billing/price-list', { currency: 'GBP', packs: [{ credits: 5, priceMinor: 80_000 }] })).status).toBe(200);
  expect((await billing('POST', '/billing/adjustments', { clientId: s.client.id, credits: CREDITS, reason: 'Fault test opening balance' })).status).toBe(201);
  engineer = await signedIn(server.base, s.engineer.email, TEST_PASSWORD, s.lab.id);
  reviewer = await signedIn(server.base, s.reviewer.email, TEST_PASSWORD, s.lab.id);
});

afterAll(async () => {
  await server?.stop();
  await probe?.end();
  await sequelize?.close();
  fs.rmSync(pdfDir, { recursive: true, force: true });
});

/**
 * Sessions of the API server (application_name 'sidecheck', not this probe nor the job queue) with
 * a transaction open for at least `minMs` (a single statement outside a transaction lasts less).
 */
async function serverTransactionsOpen(minMs = 0): Promise<number> {
  const { rows } = await probe.query(
    `SELECT count(*)::int AS n FROM pg_stat_activity WHERE datname = current_database() AND application_name = 'sidecheck' AND xact_start IS NOT NULL AND clock_timestamp() - xact_start >= $1 * interval '1 millisecond'`,
    [minMs],
  );
  return rows[0].n;
}

/** Polls every 5 ms until `check` holds (bounded: 15 s). */
async function until(what: string, check: () => Promise<boolean>): Promise<void> {
  const deadline = Date.now() + 15_000;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`${what}: not within 15 s`);
    await sleep(5);
  }
}

/** Everything the database holds about the run's issue, read in system scope. */
async function issueRecord(runId: string) {
  return asSystem(sequelize, async (transaction) => {
    const q = <T extends object>(sql: string, replacements: Record<string, unknown>) => sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction });
    const reports = await q<{ id: string; report_number: string; sha256: string; pdf: Buffer }>('SELECT id, report_number, sha256, pdf FROM reports WHERE run_id = :runId', { runId });
    const ids = reports.map((r) => r.id);
    const [{ state }] = await q<{ state: string }>('SELECT state FROM test_runs WHERE id = :runId', { runId });
    const certificates = ids.length ? await q<{ report_id: string }>('SELECT report_id FROM report_certificates WHERE report_id IN (:ids)', { ids }) : [];
    const consumptions = ids.length ? await q<{ credits: number }>(`SELECT credits FROM credit_ledger WHERE kind = 'consumption' AND report_id IN (:ids)`, { ids }) : [];
    const audits = await q<{ id: string }>(`SELECT id FROM audit_log WHERE entity = 'test-run' AND entity_id = :runId AND action = 'run-issue'`, { runId });
    const mails = reports.length
      ? await q<{ id: string }>(`SELECT id FROM pgboss.job WHERE name = 'mail' AND data->>'subject' LIKE :subject UNION ALL SELECT id FROM pgboss.archive WHERE name = 'mail' AND data->>'subject' LIKE :subject`, { subject: `Test report ${reports[0].report_number} %` })
      : [];
    return { reports, state, certificates, consumptions, audits, mails };
  });
}

/** The client's whole ledger: every consumption belongs to an existing report, and the balance adds up. */
async function ledger() {
  return asSystem(sequelize, async (transaction) => {
    const rows = await sequelize.query<{ kind: string; credits: number; report_exists: boolean }>(
      `SELECT l.kind, l.credits, (l.report_id IS NULL OR EXISTS (SELECT 1 FROM reports r WHERE r.id = l.report_id)) AS report_exists FROM credit_ledger l WHERE l.client_id = :client`,
      { replacements: { client: s.client.id }, type: QueryTypes.SELECT, transaction },
    );
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM reports r JOIN test_runs t ON t.id = r.run_id JOIN test_plans p ON p.id = t.plan_id WHERE p.device_id = :device', { replacements: { device: s.device.id }, type: QueryTypes.SELECT, transaction });
    return { rows, reportsOfClient: n, balance: rows.reduce((sum, r) => sum + r.credits, 0) };
  });
}

/** Asserts all or nothing; answers whether the run was issued. */
async function expectAllOrNothing(runId: string): Promise<boolean> {
  const r = await issueRecord(runId);
  const book = await ledger();
  expect(book.rows.every((row) => row.report_exists)).toBe(true);
  expect(book.rows.filter((row) => row.kind === 'consumption')).toHaveLength(book.reportsOfClient);
  expect(book.balance).toBe(CREDITS - book.reportsOfClient);
  if (r.reports.length === 0) {
    expect({ state: r.state, consumptions: r.consumptions.length, audits: r.audits.length }).toEqual({ state: 'approved', consumptions: 0, audits: 0 });
    return false;
  }
  expect(r.reports).toHaveLength(1);
  const [report] = r.reports;
  expect(crypto.createHash('sha256').update(report.pdf).digest('hex')).toBe(report.sha256);
  const file = path.join(pdfDir, `${report.id}.pdf`);
  fs.writeFileSync(file, report.pdf);
  // pdfsig (poppler) reads the embedded signature; it exits 0 either way, so its text is checked.
  expect(execFileSync('pdfsig', [file], { encoding: 'utf8' })).toContain('Signature is Valid.');
  expect({ state: r.state, certificates: r.certificates.length, consumptions: r.consumptions.map((c) => c.credits), audits: r.audits.length, mails: r.mails.length }).toEqual({
    state: 'issued',
    certificates: 1,
    consumptions: [-1],
    audits: 1,
    mails: 1,
  });
  return true;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

test('a report issue killed at any moment is there completely or not at all, and can be issued afterwards', async () => {
  // Two normal issues first: each must be complete; the second (the lab's signing key exists by
  // then) measures the issue time that sets where the kills land.
  let issueMs = 0;
  for (let i = 0; i < 2; i++) {
    const normal = await approvedRun(engineer, reviewer, s.plan.id);
    const t0 = Date.now();
    expect((await reviewer('POST', `/runs/${normal.id}/issue`)).status).toBe(201);
    issueMs = Date.now() - t0;
    expect(await expectAllOrNothing(normal.id)).toBe(true);
  }

  const attempts: { runId: string; kill: string; inTransaction: boolean; answered: number | null; issued?: boolean }[] = [];
  for (const when of [0.05, 0.3, 0.6, 0.9, 'after the commit'] as const) {
    const run = await approvedRun(engineer, reviewer, s.plan.id);
    const pending = reviewer('POST', `/runs/${run.id}/issue`).then((res) => res.status, () => null);
    await until('the issue’s transaction to open', async () => (await serverTransactionsOpen(30)) > 0);
    let kill: string;
    if (typeof when === 'number') {
      const delayMs = Math.round(issueMs * when * (0.8 + 0.4 * Math.random()));
      await sleep(delayMs);
      kill = `${delayMs} ms into the transaction`;
    } else {
      await until('the issue’s transaction to end', async () => (await serverTransactionsOpen()) === 0);
      kill = when;
    }
    const inTransaction = (await serverTransactionsOpen()) > 0;
    await killHard(server);
    const answered = await pending;
    attempts.push({ runId: run.id, kill, inTransaction, answered });
    // PostgreSQL aborts the dead client's transaction when it sees the socket close.
    await until('the killed server’s transactions to end', async () => (await serverTransactionsOpen()) === 0);
    attempts[attempts.length - 1].issued = await expectAllOrNothing(run.id);
    server = await start();
  }
  console.log(`issue took ${issueMs} ms; kills: ${JSON.stringify(attempts.map(({ runId: _r, ...a }) => a))}`);
  // The test is only worth something if some kill landed while the issue's transaction was open.
  expect(attempts.some((a) => a.inTransaction)).toBe(true);
  // An answer the client saw as 201 must be a complete issue.
  for (const a of attempts) if (a.answered === 201) expect(a.issued).toBe(true);

  // After the restart: each run not issued issues now, completely; an issued one is refused (409).
  for (const a of attempts) {
    const again = await reviewer('POST', `/runs/${a.runId}/issue`);
    expect(again.status).toBe(a.issued ? 409 : 201);
    expect(await expectAllOrNothing(a.runId)).toBe(true);
    if (!a.issued) {
      const pdf = await reviewer('GET', `/reports/${again.body.id}/pdf`);
      expect(pdf.status).toBe(200);
      expect(crypto.createHash('sha256').update(pdf.bytes).digest('hex')).toBe(again.body.sha256);
    }
  }
});
