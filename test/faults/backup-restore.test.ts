/**
 * Backup and restore (scripts/backup.sh, scripts/restore.sh): a lab issues a report whose run has
 * an uploaded trace, the running product is backed up, and the backup is restored into a fresh
 * private cluster and an empty files folder. Every issued report's stored PDF must still match its
 * stored SHA-256; a server started on the restored database must serve the same PDF and the same
 * uploaded file, keep row-level security (the application role sees no tenant row outside a
 * tenant transaction and is neither superuser nor BYPASSRLS), and issue the next report. A backup
 * whose bytes no longer match its manifest is refused.
 */
import crypto from 'node:crypto';
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { Client as PgClient } from 'pg';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { traceCsv } from '../../server/uploads/upload-files.test-support';
import { buildLabScenario, TEST_PASSWORD } from '../support/factories';
import { createPrivateCluster, prepareDatabase, type PrivateCluster } from '../support/private-cluster';
import { ROOT } from '../support/processes';
import { call, signedIn, startServer, type Api, type ProductServer } from '../support/product-server';

jest.setTimeout(150_000);

const run = promisify(execFile);
const sha256 = (bytes: Buffer) => crypto.createHash('sha256').update(bytes).digest('hex');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-backup-'));
const sourceFiles = path.join(work, 'source-files');
const restoredFiles = path.join(work, 'restored-files');
// A mask trace that passes: floor −90 dBm, one line at 40 dBm on the carrier's +1 kHz (invented).
const trace = traceCsv({ fromHz: -8000, toHz: 8000, stepHz: 10, floorDbm: -90, lines: [[1000, 40]] });

let source: PrivateCluster;
let target: PrivateCluster;
let sourceServer: ProductServer | undefined;
let restoredServer: ProductServer | undefined;
let s: Awaited<ReturnType<typeof buildLabScenario>>;
let otherLab: Awaited<ReturnType<typeof buildLabScenario>>;

beforeAll(async () => {
  [source, target] = await Promise.all([createPrivateCluster('pg-faults-backup-source', 54633), createPrivateCluster('pg-faults-backup-target', 54634)]);
  await prepareDatabase(source.url);
  const sequelize = createSequelize(source.url, { poolMax: 2 });
  initModels(sequelize);
  s = await buildLabScenario(sequelize, { kinds: ['carrier-suppression', 'emission-mask'] });
  otherLab = await buildLabScenario(sequelize);
  await sequelize.close();
});

afterAll(async () => {
  await sourceServer?.stop();
  await restoredServer?.stop();
  await Promise.all([source?.destroy(), target?.destroy()]);
  fs.rmSync(work, { recursive: true, force: true });
});

/** A run with a hand reading (case 1) and an uploaded trace (case 2), authorized and issued. */
async function issueWithUpload(engineer: Api, reviewer: Api) {
  const created = await engineer('POST', '/runs', { planId: s.plan.id });
  expect(created.status).toBe(201);
  const runId = created.body.id as string;
  const [reading, mask] = created.body.testCases as { id: string }[];
  // 51 dBm PEP, 8.2 dBm carrier: 42.8 dB suppression against "at least 40 dB" (47 CFR 80.207(c)), a pass.
  expect((await engineer('PUT', `/runs/${runId}/cases/${reading.id}/reading`, { values: { pepDbm: 51, carrierDbm: 8.2 } })).status).toBeLessThan(300);
  const form = new FormData();
  form.append('file', new Blob([new Uint8Array(trace)], { type: 'text/csv' }), 'trace.csv');
  form.append('referenceDbm', '40');
  const upload = await engineer('POST', `/runs/${runId}/cases/${mask.id}/uploads`, form);
  expect(upload.status).toBe(201);
  expect((await engineer('POST', `/runs/${runId}/submit`)).status).toBeLessThan(300);
  expect((await reviewer('POST', `/runs/${runId}/approve`)).status).toBeLessThan(300);
  const issued = await reviewer('POST', `/runs/${runId}/issue`);
  expect(issued.status).toBe(201);
  return { report: issued.body as { id: string; reportNumber: string; sha256: string; verifyPath: string }, uploadId: upload.body.id as string };
}

test('a backup restored into a fresh cluster serves every issued report and file unchanged, with row-level security intact', async () => {
  sourceServer = await startServer({ port: 5120, databaseUrl: source.url, dataDir: sourceFiles }, 'source server');
  const engineer = await signedIn(sourceServer.base, s.engineer.email, TEST_PASSWORD, s.lab.id);
  const reviewer = await signedIn(sourceServer.base, s.reviewer.email, TEST_PASSWORD, s.lab.id);
  const { report, uploadId } = await issueWithUpload(engineer, reviewer);
  const original = await reviewer('GET', `/reports/${report.id}/pdf`);
  expect(sha256(original.bytes)).toBe(report.sha256);

  // Backed up while the server runs.
  const t0 = Date.now();
  const backup = await run('bash', [path.join(ROOT, 'scripts', 'backup.sh'), path.join(work, 'backups')], { env: { ...process.env, BACKUP_DATABASE_URL: source.superuserUrl, SIDECHECK_DATA_DIR: sourceFiles } });
  const folder = backup.stdout.trim();
  const backupMs = Date.now() - t0;
  expect(fs.readdirSync(folder).sort()).toEqual(['SHA256SUMS', 'backup-info.txt', 'database.dump', 'files.tar.gz']);
  const manifest = fs.readFileSync(path.join(folder, 'SHA256SUMS'), 'utf8');
  for (const name of ['database.dump', 'files.tar.gz', 'backup-info.txt']) {
    expect(manifest).toContain(`${sha256(fs.readFileSync(path.join(folder, name)))}  ${name}`);
  }
  await sourceServer.stop();
  sourceServer = undefined;

  // Restored into the fresh cluster (its own application role, another password) and an empty folder.
  const t1 = Date.now();
  await run('bash', [path.join(ROOT, 'scripts', 'restore.sh'), folder], { env: { ...process.env, ...target.env, PG_FSYNC: 'off', SIDECHECK_DATA_DIR: restoredFiles } });
  const restoreMs = Date.now() - t1;
  console.log(`backup ${backupMs} ms (dump ${fs.statSync(path.join(folder, 'database.dump')).size} bytes), restore ${restoreMs} ms`);

  // Every issued report's stored PDF still matches its stored hash (read as superuser: all tenants).
  const admin = new PgClient({ connectionString: target.superuserUrl });
  await admin.connect();
  try {
    const reports = (await admin.query<{ id: string; sha256: string; pdf: Buffer }>('SELECT id, sha256, pdf FROM reports')).rows;
    expect(reports.map((r) => r.id)).toEqual([report.id]);
    for (const r of reports) expect(sha256(r.pdf)).toBe(r.sha256);
    const certificates = (await admin.query<{ sha256: string; pdf: Buffer }>('SELECT sha256, pdf FROM report_certificates')).rows;
    expect(certificates).toHaveLength(1);
    for (const c of certificates) expect(sha256(c.pdf)).toBe(c.sha256);
    const [role] = (await admin.query<{ rolsuper: boolean; rolbypassrls: boolean }>(`SELECT rolsuper, rolbypassrls FROM pg_roles WHERE rolname = 'sidecheck'`)).rows;
    expect(role).toEqual({ rolsuper: false, rolbypassrls: false });
  } finally {
    await admin.end();
  }
  // The application role outside any tenant transaction sees no tenant row (fails closed).
  const app = new PgClient({ connectionString: target.url });
  await app.connect();
  try {
    expect((await app.query('SELECT count(*)::int AS n FROM reports')).rows[0].n).toBe(0);
    await expect(app.query(`UPDATE reports SET sha256 = 'x'`)).resolves.toMatchObject({ rowCount: 0 });
  } finally {
    await app.end();
  }

  // A server on the restored database and folder serves the same bytes.
  restoredServer = await startServer({ port: 5121, databaseUrl: target.url, dataDir: restoredFiles }, 'restored server');
  const reviewer2 = await signedIn(restoredServer.base, s.reviewer.email, TEST_PASSWORD, s.lab.id);
  const pdf = await reviewer2('GET', `/reports/${report.id}/pdf`);
  expect(pdf.status).toBe(200);
  expect(sha256(pdf.bytes)).toBe(report.sha256);
  const file = await reviewer2('GET', `/uploads/${uploadId}/file`);
  expect(file.status).toBe(200);
  expect(sha256(file.bytes)).toBe(sha256(trace));
  expect(file.headers.get('repr-digest')).toBe(`sha-256=:${crypto.createHash('sha256').update(trace).digest('base64')}:`);
  const verify = await call(restoredServer.base, 'GET', report.verifyPath);
  expect(verify.body).toMatchObject({ reportNumber: report.reportNumber, status: 'current', sha256: report.sha256 });
  // Another lab's person sees none of it (row-level security on the restored database).
  const stranger = await signedIn(restoredServer.base, otherLab.engineer.email, TEST_PASSWORD, otherLab.lab.id);
  expect((await stranger('GET', `/reports/${report.id}`)).status).toBe(404);
  expect((await stranger('GET', `/uploads/${uploadId}`)).status).toBe(404);

  // Work goes on: the lab's signing key, counters and store work, so the next report is issued.
  const engineer2 = await signedIn(restoredServer.base, s.engineer.email, TEST_PASSWORD, s.lab.id);
  const next = await issueWithUpload(engineer2, reviewer2);
  expect(next.report.reportNumber).toBe(report.reportNumber.replace(/\d{4}$/, '0002'));
});

test('a backup that does not match its manifest is refused before anything is restored', async () => {
  const backups = path.join(work, 'backups');
  const folder = path.join(backups, fs.readdirSync(backups).find((f) => f.startsWith('sidecheck-'))!);
  const copy = path.join(work, 'tampered');
  fs.cpSync(folder, copy, { recursive: true });
  const archive = path.join(copy, 'files.tar.gz');
  const bytes = fs.readFileSync(archive);
  bytes[bytes.length - 20] ^= 0xff;
  fs.writeFileSync(archive, bytes);
  const emptyFolder = path.join(work, 'never-filled');
  const failed = await run('bash', [path.join(ROOT, 'scripts', 'restore.sh'), copy], { env: { ...process.env, RESTORE_DATABASE_URL: 'postgres://nobody@127.0.0.1:9/none', SIDECHECK_DATA_DIR: emptyFolder } }).then(
    () => null,
    (error: { code: number; stderr: string }) => error,
  );
  expect(failed?.code).toBe(1);
  expect(failed?.stderr).toMatch(/does not match its SHA-256 manifest; nothing was restored/);
  expect(fs.existsSync(emptyFolder)).toBe(false);
});
