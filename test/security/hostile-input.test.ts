/**
 * Hostile and malformed input against every write route of the route table (issue 8, and issue 4's
 * "bad input for every write"): the corpus in test/security/corpus is sent by a caller whom the
 * route's access rule admits, to the real app on the real database. Every answer must be a 4xx
 * problem+json with a title and a detail a person can act on — never a 5xx, never a hang — the
 * server must keep answering /api/health, and nothing may be stored: no table of the public
 * schema changes (row count and newest row version, xmin), no upload row, no file in the store.
 * Prototype-pollution keys must not reach Object.prototype. List routes get SQL-looking filters
 * and sort keys and answer a normal page or 400/422 (404 only for a record named in the path), never 500.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../support/test-app';
import { buildLabScenario, signIn } from '../support/factories';
import { routeTable } from '../../server/route-table';
import type { RouteDef } from '../../server/http/route';
import { validate } from '../../server/http/validation';
import { asSystem } from '../../server/tenancy/tenant-transaction';
import { RuleSet } from '../../server/db/models';
import { storedFiles } from '../../server/uploads/upload-files.test-support';
import type { Role } from '../../shared/access/roles';
import {
  BAD_PATH_IDS,
  bodyMutations,
  countCorpus,
  fileNameCorpus,
  HOSTILE_LIST_QUERIES,
  hostileFiles,
  RAW_BODIES,
  SHAPE_BODIES,
  validTraceCsv,
  type HostileFile,
  type SchemaNode,
} from './corpus';

jest.setTimeout(240_000);

const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-hostile-'));
/** A request that has not answered within this time counts as a hang (common practice: generous on a busy 2-core machine). */
const HANG_MS = 30_000;
/** Requests in flight at once (the app's pool holds 5 connections). */
const CONCURRENCY = 4;
const NIL_UUID = '00000000-0000-0000-0000-000000000000';
const PASSWORD = 'Hostile-input-42-password';

let t: TestApp;
let s: Awaited<ReturnType<typeof buildLabScenario>>;
const auth = new Map<Role, { token: string; org: string }>();
const ids: Record<string, string> = {};
let routes: RouteDef[];
let prototypeKeys: string[];
let requestsSent = 0;

beforeAll(async () => {
  prototypeKeys = Object.getOwnPropertyNames(Object.prototype).sort();
  process.env.SIDECHECK_DATA_DIR = dataDir;
  process.env.SIDECHECK_PRECHECK_PER_HOUR = '1000000';
  t = await startTestApp();
  s = await buildLabScenario(t.sequelize, { kinds: ['emission-mask', 'unwanted-sideband'] });
  const people: [Role, { email: string }, string][] = [
    ['lab-admin', s.admin, s.lab.id],
    ['engineer', s.engineer, s.lab.id],
    ['reviewer', s.reviewer, s.lab.id],
    ['billing', s.billing, s.lab.id],
    ['manufacturer-admin', s.makerAdmin, s.maker.id],
    ['manufacturer-viewer', s.makerViewer, s.maker.id],
  ];
  for (const [role, person, org] of people) auth.set(role, { token: (await signIn(t.app, person.email)).token, org });
  const as = (role: Role, method: 'get' | 'post', url: string) => request(t.app)[method](`/api${url}`).set('Authorization', `Bearer ${auth.get(role)!.token}`).set('X-Organization-Id', auth.get(role)!.org);
  // Records for the routes' path parameters, made through the API as a person would.
  const run = await as('engineer', 'post', '/runs').send({ planId: s.plan.id });
  ids.run = run.body.id;
  ids.maskCase = run.body.testCases.find((c: { kind: string }) => c.kind === 'emission-mask').id;
  ids.iqCase = run.body.testCases.find((c: { kind: string }) => c.kind === 'unwanted-sideband').id;
  const builtIn = await asSystem(t.sequelize, (transaction) => RuleSet.findOne({ where: { organizationId: null, key: 'us-maritime-hf-ssb' }, transaction }));
  ids.builtInRuleSet = builtIn!.id;
  ids.ruleSetBody = JSON.stringify(builtIn!.body);
  const copy = await as('engineer', 'post', `/rule-sets/${builtIn!.id}/copy`).send({ name: 'Hostile-input copy' });
  ids.ruleSet = copy.body.id;
  const instrument = await as('engineer', 'post', '/instruments').send(validBodies()['post /instruments']);
  ids.instrument = instrument.body.id;
  const key = await as('lab-admin', 'post', '/api-keys').send({ name: 'Hostile bench' });
  ids.apiKey = key.body.id;
  const sample = await as('manufacturer-admin', 'get', '/precheck/rule-sets');
  ids.sampleRuleSet = sample.body.items[0].id;
  for (const [name, value] of Object.entries(ids)) if (!value) throw new Error(`setup: no ${name}`);
  routes = routeTable({ sequelize: {} as never, tokens: { secret: 'x', accessTtlSeconds: 1, refreshTtlSeconds: 1 }, secureCookies: false, reports: {} as never, mail: {} as never, publicUrl: '', billing: {} as never });
  const counts = await countCorpus();
  console.log(`hostile-input corpus: ${counts.total} inputs (${Object.entries(counts).filter(([k]) => k !== 'total').map(([k, v]) => `${k} ${v}`).join(', ')})`);
}, 120_000);

const savedEnv = { SIDECHECK_DATA_DIR: process.env.SIDECHECK_DATA_DIR, SIDECHECK_PRECHECK_PER_HOUR: process.env.SIDECHECK_PRECHECK_PER_HOUR };
afterAll(async () => {
  for (const [name, value] of Object.entries(savedEnv)) {
    if (value === undefined) delete process.env[name];
    else process.env[name] = value;
  }
  await t?.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
  const lines = [...statusSeen].map(([name, seen]) => `  ${name.slice(0, 70)}: ${[...seen].sort(([a], [b]) => a - b).map(([status, n]) => `${status}x${n}`).join(' ')}`);
  console.log(`hostile-input: ${requestsSent} requests sent; answers by status:\n${lines.join('\n')}`);
});

/** A valid body for every route with a body schema (checked against the schema below): the corpus mutates these. */
function validBodies(): Record<string, Record<string, unknown>> {
  const device = { clientId: s.client.id, manufacturer: 'Hostile Radio Works', model: 'HX-1', serialNumber: 'HX-0001', firmware: '1.0', ratedPepW: 100, emissionDesignator: '2K70J3E', frequencyMinHz: 1.6e6, frequencyMaxHz: 27.5e6, modes: ['USB'], receivedOn: '2026-11-02', condition: 'Good' };
  const client = { name: 'Hostile Client', addressLines: ['1 Quay'], contactName: 'Casey Contact', contactEmail: 'casey@client.example', invoiceLater: false };
  const instrument = { name: 'Spectrum analyzer', model: 'SA-9', serialNumber: 'SA-0009', calibratedOn: '2026-06-01', calibrationDue: '2027-06-01', certificateRef: 'CAL-9', contributions: [{ name: 'Level accuracy', distribution: 'normal', value: 0.5, coverageFactor: 2, sensitivity: 1, budget: 'absolute' }] };
  return {
    'post /auth/sign-in': { email: s.engineer.email, password: PASSWORD },
    'post /auth/sign-up': { labName: 'Hostile Lab', labCode: 'HOST1', address: ['1 Road'], name: 'Pat Person', email: 'pat@hostile.example', password: PASSWORD },
    'post /auth/password-reset/request': { email: 'pat@hostile.example' },
    'post /auth/password-reset/complete': { token: 'A'.repeat(43), password: PASSWORD },
    'put /members/:userId/roles': { roles: ['engineer'] },
    'post /invitations': { email: 'invitee@hostile.example', role: 'engineer' },
    'post /invitations/accept': { token: 'A'.repeat(43), name: 'Pat Person', password: PASSWORD },
    'post /clients/:id/invitations': {},
    'post /api-keys': { name: 'Bench key' },
    'post /auditor-grants': { email: 'auditor@hostile.example', scope: 'client', clientId: s.client.id, expiresOn: '2027-01-31', note: 'Annual audit' },
    'put /organization/mail-settings': { attachPdfToEmail: true },
    'put /organization': { name: 'Hostile Lab', addressLines: ['1 Road'], email: 'lab@hostile.example', phone: '+44 1 234', accreditation: 'ACC-1' },
    'post /clients': client,
    'put /clients/:id': client,
    'post /devices': device,
    'put /devices/:id': device,
    'post /rule-sets/:id/copy': { name: 'Copy of a rule set' },
    'put /rule-sets/:id': { name: 'Edited rule set', body: JSON.parse(ids.ruleSetBody ?? '{}') },
    'post /instruments': instrument,
    'put /instruments/:id': instrument,
    'post /plans': { deviceId: s.device.id, ruleSetId: ids.builtInRuleSet ?? NIL_UUID, name: 'Hostile plan', testPoints: [{ kind: 'carrier-suppression', label: 'Carrier', frequencyHz: 2_182_000, sideband: 'USB', powerLevel: 'full' }] },
    'post /runs': { planId: s.plan.id },
    'put /runs/:id/cases/:caseId/reading': { values: { pepDbm: 40, note: 'ok' } },
    'put /runs/:id/instruments': { instrumentIds: [ids.instrument ?? NIL_UUID] },
    'post /runs/:id/return': { reason: 'Please measure again.' },
    'post /runs/:id/cases/:caseId/comments': { body: 'Looks fine to me.' },
    'post /reports/:id/withdraw': { reason: 'Issued in error.' },
    'post /runs/:id/revise': { reason: 'Correct a typo.' },
    'put /billing/price-list': { currency: 'EUR', packs: [{ credits: 5, priceMinor: 5000 }], refundOnWithdrawWithinDays: 30 },
    'post /billing/adjustments': { clientId: s.client.id, credits: 2, reason: 'Goodwill' },
    'post /billing/checkout': { labId: s.lab.id, packId: 'pack-5' },
  };
}

const keyOf = (r: RouteDef) => `${r.method} ${r.path}`;
const isWrite = (r: RouteDef) => r.method !== 'get';
const isMultipart = (r: RouteDef) => r.path.endsWith('/uploads') || r.path === '/precheck';

/** The value of each path parameter: records of the scenario (reports and invitations name nothing). */
function paramValue(routePath: string, param: string): string {
  if (param === 'caseId') return ids.maskCase;
  if (param === 'userId') return s.engineer.id;
  if (param === 'token') return 'no-such-token-000';
  const prefix = routePath.split('/')[1];
  const byPrefix: Record<string, string> = { clients: s.client.id, devices: s.device.id, 'rule-sets': ids.ruleSet, instruments: ids.instrument, runs: ids.run, 'api-keys': ids.apiKey, uploads: NIL_UUID, reports: NIL_UUID, invitations: NIL_UUID, 'auditor-grants': NIL_UUID, billing: NIL_UUID, auditor: NIL_UUID };
  return byPrefix[prefix] ?? NIL_UUID;
}

function fill(routePath: string, override: { param?: string; segment?: string } = {}): string {
  return routePath.replace(/:(\w+)/g, (_, name: string) => (name === override.param ? override.segment! : paramValue(routePath, name)));
}

/** Who calls the route: the first role its rule admits (manufacturer routes as the maker). */
function callerFor(r: RouteDef): { token: string; org: string } | null {
  if (r.access.kind === 'public') return null;
  if (r.access.kind === 'signed-in') return auth.get('engineer')!;
  return auth.get(r.access.roles[0])!;
}

function send(r: RouteDef, url: string, body?: { text: string } | { file: HostileFile } | { json: unknown }) {
  requestsSent++;
  let req = (request(t.app) as unknown as Record<string, (u: string) => request.Test>)[r.method](`/api${url}`).timeout({ response: HANG_MS, deadline: HANG_MS });
  const caller = callerFor(r);
  if (caller) req = req.set('Authorization', `Bearer ${caller.token}`).set('X-Organization-Id', caller.org);
  if (body && 'text' in body) return req.set('Content-Type', 'application/json').send(body.text);
  if (body && 'json' in body) return req.send(body.json as object);
  if (body && 'file' in body) {
    const entry = body.file;
    for (const [name, value] of Object.entries(entry.fields)) req = req.field(name, value);
    if (r.path === '/precheck') req = req.field('ruleSetId', ids.sampleRuleSet);
    for (const [field, part] of [['file', entry.file], ['data', entry.data]] as const) {
      if (part) req = req.attach(field, part.bytes, { filepath: part.name, contentType: part.contentType ?? 'application/octet-stream' } as unknown as { filename: string });
    }
    return req;
  }
  return req;
}

/** Row count and newest row version (xmin) of every table of the public schema: any insert, update or delete changes it. */
async function fingerprint(): Promise<Record<string, string>> {
  return asSystem(t.sequelize, async (transaction) => {
    const tables = await t.sequelize.query<{ name: string }>("SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' AND tablename <> 'SequelizeMeta' ORDER BY 1", { type: QueryTypes.SELECT, transaction });
    const union = tables.map((x) => `SELECT '${x.name}' AS name, count(*) || '/' || coalesce(max(xmin::text::bigint), 0) AS state FROM "${x.name}"`).join(' UNION ALL ');
    const rows = await t.sequelize.query<{ name: string; state: string }>(union, { type: QueryTypes.SELECT, transaction });
    return Object.fromEntries(rows.map((row) => [row.name, row.state]));
  });
}

/** Tables that count attempts by design (the pre-check allowance counts refused attempts too): not "stored" data. */
const ATTEMPT_COUNTERS = ['precheck_starts'];

/** The tables whose fingerprint differs, apart from the attempt counters. */
function changedTables(before: Record<string, string>, after: Record<string, string>): string[] {
  return Object.keys(after).filter((table) => after[table] !== before[table] && !ATTEMPT_COUNTERS.includes(table));
}

interface Failure {
  route: string;
  input: string;
  status: number | string;
  detail: string;
}

/** Largest refusal we expect, bytes: a problem names a few fields; a bigger answer would amplify a hostile request (common practice). */
const MAX_PROBLEM_BYTES = 20_000;

/** Checks one answer: a small 4xx problem+json with a title and an actionable detail (and the expected status, when given). */
function judge(failures: Failure[], route: string, input: string, res: request.Response, allowed?: number[]): boolean {
  const body = res.body as { title?: unknown; detail?: unknown };
  const problem = /application\/problem\+json/.test(String(res.headers['content-type'])) && typeof body.title === 'string' && body.title.length > 0 && typeof body.detail === 'string' && body.detail.length >= 10;
  const ok = res.status >= 400 && res.status < 500 && problem && res.text.length <= MAX_PROBLEM_BYTES && (!allowed || allowed.includes(res.status));
  if (!ok) failures.push({ route, input, status: res.status, detail: `${String(body.detail ?? res.text).slice(0, 200)} (${res.text.length} bytes)` });
  return ok;
}

async function pool<T>(items: T[], work: (item: T) => Promise<void>): Promise<void> {
  let next = 0;
  await Promise.all(Array.from({ length: CONCURRENCY }, async () => {
    while (next < items.length) await work(items[next++]);
  }));
}

/** Answers by status, per test, printed at the end (what the walks saw). */
const statusSeen = new Map<string, Map<number, number>>();

async function sendSafely(failures: Failure[], route: string, input: string, action: () => PromiseLike<request.Response>): Promise<request.Response | null> {
  try {
    const res = await action();
    const name = expect.getState().currentTestName ?? '';
    const seen = statusSeen.get(name) ?? new Map<number, number>();
    seen.set(res.status, (seen.get(res.status) ?? 0) + 1);
    statusSeen.set(name, seen);
    return res;
  } catch (error) {
    failures.push({ route, input, status: 'no answer', detail: (error as Error).message });
    return null;
  }
}

async function expectHealthy() {
  const res = await request(t.app).get('/api/health').timeout({ response: HANG_MS, deadline: HANG_MS });
  expect(res.status).toBe(200);
}

test('the valid bodies the corpus mutates are accepted by each route’s schema (so a refusal is the corpus’s doing)', () => {
  const bodies = validBodies();
  const withSchema = routes.filter((r) => r.bodySchema);
  expect(withSchema.map(keyOf).filter((k) => !(k in bodies))).toEqual([]);
  for (const r of withSchema) expect(() => validate(r.bodySchema!, bodies[keyOf(r)])).not.toThrow();
});

test('every write route refuses hostile JSON bodies with a 4xx problem, stores nothing and keeps serving', async () => {
  const bodies = validBodies();
  const failures: Failure[] = [];
  const writes = routes.filter(isWrite);
  expect(writes.length).toBeGreaterThan(30);
  for (const r of writes) {
    const key = keyOf(r);
    const url = fill(r.path);
    const inputs: { label: string; text: string; allowed?: number[] }[] = RAW_BODIES.map((b) => ({ label: `raw: ${b.label}`, text: b.text, allowed: [b.status] }));
    // Bodies that are JSON but hostile apply where the body is read: a schema, the webhook's signature, the multipart reader.
    // (Not where the shape is a valid body: an empty object is a whole request for some routes.)
    const validShape = (text: string) => r.bodySchema !== undefined && (() => { try { validate(r.bodySchema!, JSON.parse(text)); return true; } catch { return false; } })();
    if (r.bodySchema || isMultipart(r) || r.path === '/billing/webhook') inputs.push(...SHAPE_BODIES.filter((b) => !validShape(b.text)).map((b) => ({ label: `shape: ${b.label}`, text: b.text })));
    if (r.bodySchema && !bodies[key]) failures.push({ route: key, input: '(setup)', status: 'no valid body', detail: 'add a valid body for this route to validBodies()' });
    else if (r.bodySchema) {
      for (const m of bodyMutations(r.bodySchema as SchemaNode, bodies[key])) inputs.push({ label: `field: ${m.label}`, text: m.text, allowed: m.invalidJson ? [400] : [400, 413, 422] });
    }
    const before = await fingerprint();
    await pool(inputs, async (input) => {
      const res = await sendSafely(failures, key, input.label, () => send(r, url, { text: input.text }));
      if (res) judge(failures, key, input.label, res, input.allowed);
    });
    const after = await fingerprint();
    const changed = changedTables(before, after);
    if (changed.length) failures.push({ route: key, input: '(whole batch)', status: 'stored', detail: `tables changed: ${changed.join(', ')}` });
    await expectHealthy();
  }
  expect(failures).toEqual([]);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  expect(Object.getOwnPropertyNames(Object.prototype).sort()).toEqual(prototypeKeys);
});

test('every write route answers 400/404 for a hostile id in its path (SQL, NUL, traversal, bad escapes, ids that name nothing)', async () => {
  const bodies = validBodies();
  const failures: Failure[] = [];
  const withParams = routes.filter((r) => isWrite(r) && r.path.includes(':'));
  const before = await fingerprint();
  const filesBefore = await storedFiles(dataDir);
  for (const r of withParams) {
    const key = keyOf(r);
    const params = [...r.path.matchAll(/:(\w+)/g)].map((m) => m[1]);
    const cases = params.flatMap((param) => BAD_PATH_IDS.map((bad) => ({ param, bad })));
    await pool(cases, async ({ param, bad }) => {
      const url = fill(r.path, { param, segment: bad.segment });
      const body = isMultipart(r)
        ? { file: { label: 'valid trace', group: 'trace-csv', file: { bytes: Buffer.from(validTraceCsv()), name: 'trace.csv' }, fields: { referenceDbm: '40' }, caseKind: 'emission-mask', expect: 'refuse' } as HostileFile }
        : { json: bodies[key] ?? {} };
      const res = await sendSafely(failures, key, `:${param} = ${bad.label}`, () => send(r, url, body));
      if (res) judge(failures, key, `:${param} = ${bad.label}`, res, [400, 404]);
    });
  }
  const after = await fingerprint();
  expect(changedTables(before, after)).toEqual([]);
  expect(await storedFiles(dataDir)).toEqual(filesBefore);
  expect(failures).toEqual([]);
  await expectHealthy();
});

test('hostile credentials (malformed or unsigned tokens, SQL in API keys) get 401/403 on write routes, and the pre-check refuses hostile rule-set ids', async () => {
  const failures: Failure[] = [];
  const unsigned = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${Buffer.from(JSON.stringify({ sub: s.admin.id, exp: 9_999_999_999 })).toString('base64url')}.`;
  const headers: [string, string, string][] = [
    ['Authorization', 'Bearer', 'Bearer without a token'],
    ['Authorization', 'Bearer not.a.jwt', 'Bearer of three junk parts'],
    ['Authorization', `Bearer ${unsigned}`, 'an unsigned (alg none) token'],
    ['Authorization', `Bearer ${'a'.repeat(8000)}`, 'an 8000-character token'],
    ['Authorization', "ApiKey ' OR 1=1 --", 'SQL as an API key'],
    ['Authorization', `ApiKey sck_${'x'.repeat(4000)}`, 'a 4000-character API key'],
    ['X-Api-Key', "sck_'; DROP TABLE api_keys; --", 'SQL in X-Api-Key'],
    ['Authorization', 'Basic YWRtaW46YWRtaW4=', 'Basic credentials'],
  ];
  const targets = routes.filter((r) => ['post /devices', 'put /runs/:id/cases/:caseId/reading', 'delete /api-keys/:id'].includes(keyOf(r)));
  const before = await fingerprint();
  for (const r of targets) {
    for (const [name, value, label] of headers) {
      requestsSent++;
      const res = await sendSafely(failures, keyOf(r), label, () => (request(t.app) as unknown as Record<string, (u: string) => request.Test>)[r.method](`/api${fill(r.path)}`).timeout({ response: HANG_MS, deadline: HANG_MS }).set(name, value).send(validBodies()[keyOf(r)] ?? {}));
      if (res) judge(failures, keyOf(r), label, res, [401, 403]);
    }
  }
  const precheck = routes.find((r) => r.path === '/precheck')!;
  const trace = { bytes: Buffer.from(validTraceCsv()), name: 'trace.csv' };
  for (const bad of BAD_PATH_IDS) {
    const entry: HostileFile = { label: `ruleSetId ${bad.label}`, group: 'trace-csv', file: trace, fields: { referenceDbm: '40' }, caseKind: 'emission-mask', expect: 'refuse' };
    let value: string;
    try {
      value = decodeURIComponent(bad.segment);
    } catch {
      value = bad.segment;
    }
    requestsSent++;
    // The corpus entry's fields come first; ruleSetId is then sent twice (the route's own and this one) or once when it is ours.
    const res = await sendSafely(failures, 'post /precheck', entry.label, () => {
      let req = request(t.app).post('/api/precheck').timeout({ response: HANG_MS, deadline: HANG_MS }).set('Authorization', `Bearer ${callerFor(precheck)!.token}`).set('X-Organization-Id', callerFor(precheck)!.org);
      req = req.field('referenceDbm', '40').field('ruleSetId', value.slice(0, 200));
      return req.attach('file', trace.bytes, { filepath: trace.name, contentType: 'text/csv' } as unknown as { filename: string });
    });
    if (res) judge(failures, 'post /precheck', entry.label, res, [400, 404, 422]);
  }
  const after = await fingerprint();
  expect(changedTables(before, after)).toEqual([]);
  expect(failures).toEqual([]);
  await expectHealthy();
});

/** Events a leaked signing secret or a provider fault could deliver: signed, but malformed or hostile inside. */
const SIGNED_HOSTILE_EVENTS: { label: string; text: string }[] = [
  { label: 'an event without data', text: '{"id":"evt_h1","object":"event","type":"checkout.session.completed"}' },
  { label: 'data.object null', text: '{"id":"evt_h2","object":"event","type":"checkout.session.completed","data":{"object":null}}' },
  { label: 'no type', text: '{"id":"evt_h3","object":"event","data":{"object":{}}}' },
  { label: 'id and type that are objects', text: '{"id":{"$ne":null},"object":"event","type":{"toString":1},"data":{"object":{}}}' },
  { label: 'SQL as the purchase id', text: JSON.stringify({ id: 'evt_h4', object: 'event', type: 'checkout.session.completed', data: { object: { id: 'cs_h4', payment_status: 'paid', metadata: { purchaseId: "' OR 1=1 --" } } } }) },
  { label: 'an operator object as the session id', text: JSON.stringify({ id: 'evt_h5', object: 'event', type: 'checkout.session.expired', data: { object: { id: { $ne: null }, metadata: { purchaseId: { $ne: null } } } } }) },
  { label: 'a failed payment with a 1 MB reason and NUL', text: JSON.stringify({ id: 'evt_h6', object: 'event', type: 'payment_intent.payment_failed', data: { object: { id: 'pi_h6', metadata: { purchaseId: NIL_UUID }, last_payment_error: { message: `\u0000${'x'.repeat(1000)}` } } } }) },
  { label: 'prototype keys in the metadata', text: '{"id":"evt_h7","object":"event","type":"checkout.session.completed","data":{"object":{"id":"cs_h7","payment_status":"paid","metadata":{"__proto__":{"polluted":"yes"},"constructor":{"prototype":{"polluted":"yes"}}}}}}' },
  { label: 'credits 1e999 with every id well-formed', text: JSON.stringify({ id: 'evt_h8', object: 'event', type: 'checkout.session.completed', data: { object: { id: 'cs_h8', payment_status: 'paid', amount_total: 100, currency: 'eur', metadata: { purchaseId: NIL_UUID, labId: NIL_UUID, clientId: NIL_UUID, buyerOrganizationId: NIL_UUID, packId: 'pack-5', credits: '1e999' } } } }).replace('"1e999"', '1e999') },
];

test('the payment webhook, even when the body is correctly signed, refuses what is not a well-formed event (4xx) and stores nothing', async () => {
  // Signature as the provider makes it: t=<unix>,v1=HMAC-SHA256(secret, "<t>.<raw body>") (the startTestApp secret).
  const sign = (body: string) => {
    const at = Math.floor(Date.now() / 1000);
    return `t=${at},v1=${crypto.createHmac('sha256', 'whsec_test_only').update(`${at}.${body}`).digest('hex')}`;
  };
  const failures: Failure[] = [];
  const webhook = routes.find((r) => r.path === '/billing/webhook')!;
  const bodies = [...RAW_BODIES.filter((b) => b.status === 400), ...SHAPE_BODIES, ...SIGNED_HOSTILE_EVENTS];
  const before = await fingerprint();
  await pool(bodies, async (b) => {
    const res = await sendSafely(failures, 'post /billing/webhook (signed)', b.label, () => send(webhook, '/billing/webhook', { text: b.text }).set('Stripe-Signature', sign(b.text)));
    // An event of a kind it does not act on, or for no known purchase, is acknowledged (200) so the provider stops retrying.
    if (res && res.status !== 200) judge(failures, 'post /billing/webhook (signed)', b.label, res);
  });
  const after = await fingerprint();
  expect(changedTables(before, after)).toEqual([]);
  expect(failures).toEqual([]);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  await expectHealthy();
});

describe('uploads and the pre-check refuse hostile files with a 4xx problem and store nothing', () => {
  const uploadCount = () =>
    asSystem(t.sequelize, async (transaction) => {
      const [row] = await t.sequelize.query<{ n: string }>('SELECT (SELECT count(*) FROM uploads) + (SELECT count(*) FROM results) + (SELECT count(*) FROM audit_log) AS n', { type: QueryTypes.SELECT, transaction });
      return Number(row.n);
    });

  async function walk(r: RouteDef, entries: HostileFile[]) {
    const failures: Failure[] = [];
    const key = keyOf(r);
    const accepted: string[] = [];
    for (const entry of entries) {
      const url = fill(r.path).replace(ids.maskCase, entry.caseKind === 'emission-mask' ? ids.maskCase : ids.iqCase);
      const rows = await uploadCount();
      const files = await storedFiles(dataDir);
      const res = await sendSafely(failures, key, entry.label, () => send(r, url, { file: entry }));
      if (!res) continue;
      if (entry.expect === 'either' && res.status < 300) {
        accepted.push(entry.label);
        continue;
      }
      if (!judge(failures, key, entry.label, res)) continue;
      if ((await uploadCount()) !== rows) failures.push({ route: key, input: entry.label, status: res.status, detail: 'a row was stored for a refused upload' });
      if (JSON.stringify(await storedFiles(dataDir)) !== JSON.stringify(files)) failures.push({ route: key, input: entry.label, status: res.status, detail: 'a file was left in the store' });
    }
    await expectHealthy();
    return { failures, accepted };
  }

  test('POST /runs/:id/cases/:caseId/uploads: every hostile file and file name', async () => {
    const entries = [...(await hostileFiles()), ...fileNameCorpus()];
    const { failures, accepted } = await walk(routes.find((r) => r.path === '/runs/:id/cases/:caseId/uploads')!, entries);
    console.log(`uploads: ${entries.length} hostile files sent, ${entries.filter((e) => e.expect === 'refuse').length} must be refused, ${accepted.length} odd-but-readable accepted (${accepted.join('; ')})`);
    expect(failures).toEqual([]);
    expect(fs.readdirSync(path.join(dataDir, '.incoming')).length).toBe(0);
  });

  test('POST /precheck: every hostile file', async () => {
    const entries = await hostileFiles();
    const before = await fingerprint();
    const { failures } = await walk(routes.find((r) => r.path === '/precheck')!, entries);
    expect(failures).toEqual([]);
    // The pre-check stores nothing, ever.
    const after = await fingerprint();
    expect(changedTables(before, after)).toEqual([]);
  });
});

test('list routes answer SQL-looking filters, sort keys and oversize pages with a page or 400/422 (404 only for a record in the path), never 500', async () => {
  const failures: Failure[] = [];
  const lists = routes.filter((r) => r.method === 'get' && (!/:\w+$/.test(r.path) || r.path.endsWith('/uploads')) && !r.path.includes(':token') && !r.path.endsWith('/pdf') && !r.path.endsWith('/receipt') && !r.path.endsWith('/certificate'));
  lists.push(routes.find((r) => r.path === '/uploads/:id/file')!);
  const before = await fingerprint();
  for (const r of lists) {
    const key = keyOf(r);
    await pool(HOSTILE_LIST_QUERIES, async (q) => {
      const res = await sendSafely(failures, key, q.label, () => send(r, `${fill(r.path)}?${q.query}`));
      if (!res) return;
      if (res.status === 200) return;
      // 404 only where the path names a record (a filter id that names nothing is an empty page, a malformed one 400).
      judge(failures, key, `?${q.label}`, res, r.path.includes(':') ? [400, 404, 422] : [400, 422]);
    });
  }
  const after = await fingerprint();
  expect(changedTables(before, after)).toEqual([]);
  expect(failures).toEqual([]);
  expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  await expectHealthy();
});
