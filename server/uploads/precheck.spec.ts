/**
 * The manufacturer's self-service pre-check: the lab's analysis on the maker's own file against
 * a built-in sample rule set, every margin and the phasing diagnosis in the answer, marked
 * unaccredited, and nothing stored anywhere (no upload, no result, no report, no file).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser, signIn } from '../../test/support/factories';
import { asSystem } from '../tenancy/tenant-transaction';
import { PRECHECK_NOTICE } from '../../shared/schemas/uploads';
import { belowCrestDb, CARRIER_HZ, postFiles, sigmfPair, storedFiles, traceCsv } from './upload-files.test-support';

jest.setTimeout(60_000);
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-precheck-'));
const PER_HOUR = 3;
let t: TestApp;
let sampleIds: Record<string, string>;

beforeAll(async () => {
  process.env.SIDECHECK_DATA_DIR = dataDir;
  process.env.SIDECHECK_PRECHECK_PER_HOUR = String(PER_HOUR);
  process.env.SIDECHECK_PRECHECK_MAX_BYTES = '1000000';
  t = await startTestApp();
  const rows = await asSystem(t.sequelize, (transaction) => t.sequelize.query<{ id: string; key: string }>('SELECT id, key FROM rule_sets WHERE organization_id IS NULL', { type: QueryTypes.SELECT, transaction }));
  sampleIds = Object.fromEntries(rows.map((r) => [r.key, r.id]));
}, 60_000);
afterAll(async () => {
  await t?.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

/** A fresh maker person (the rate limit counts per person), signed in. */
async function maker(role: 'manufacturer-admin' | 'manufacturer-viewer' = 'manufacturer-viewer') {
  const s = await buildLabScenario(t.sequelize);
  const person = await buildUser(t.sequelize, s.maker.id, [role]);
  const { token } = await signIn(t.app, person.email);
  return { s, auth: { token, org: s.maker.id } };
}

/**
 * The rows of this scenario's two organizations. Counted per organization, not over the whole
 * table: the other API spec files run in parallel on the same database and store results of their own.
 */
const totals = (orgIds: string[]) =>
  asSystem(t.sequelize, async (transaction) => {
    const [row] = await t.sequelize.query<Record<string, string>>(
      'SELECT (SELECT count(*) FROM uploads WHERE organization_id IN (:orgIds)) AS uploads, (SELECT count(*) FROM results WHERE organization_id IN (:orgIds)) AS results, (SELECT count(*) FROM reports WHERE organization_id IN (:orgIds)) AS reports',
      { type: QueryTypes.SELECT, transaction, replacements: { orgIds } },
    );
    return row;
  });

describe('POST /precheck', () => {
  it('returns every margin and the phasing diagnosis of a capture, unaccredited, and stores nothing', async () => {
    const m = await maker('manufacturer-admin');
    // A one-tone capture with a 1° quadrature error: IRR = cot²(0.5°) = 41.18 dB (phasing relation,
    // published), carrier 42 dB below PEP.
    const { meta, data, truth } = await sigmfPair({ sampleRateHz: 48_000, sampleCount: 96_000, sideband: 'usb', tones: [{ audioHz: 1000, levelDbfs: -6 }], phaseErrorDeg: 1, carrierLeakBelowPepDb: 42, noise: { powerDbfs: -95, seed: 2 } });
    const orgs = [m.s.lab.id, m.s.maker.id];
    const before = { rows: await totals(orgs), files: await storedFiles(dataDir) };
    const res = await postFiles(t.app, '/precheck', m.auth, { file: { bytes: meta, name: 'mine.sigmf-meta' }, data: { bytes: data, name: 'mine.sigmf-data' }, fields: { ruleSetId: sampleIds['us-maritime-hf-ssb'] } });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ unaccredited: true, notice: PRECHECK_NOTICE, ruleSet: { key: 'us-maritime-hf-ssb' }, format: 'sigmf' });
    expect(res.body.notice).toBe('Engineering pre-check: not an accredited result and cannot become a report');
    const check = (kind: string) => res.body.checks.find((c: { kind: string }) => c.kind === kind);
    // 47 CFR 80.207(c): carrier at least 40 dB below PEP.
    expect(Math.abs(check('carrier-suppression').value - belowCrestDb(truth, truth.carrierPowerLinear))).toBeLessThan(0.3);
    expect(check('carrier-suppression').margin).toBeCloseTo(check('carrier-suppression').value - 40, 10);
    expect(Math.abs(check('unwanted-sideband').value - truth.imageRejectionDb)).toBeLessThan(0.3);
    expect(Math.abs(truth.imageRejectionDb - 41.18)).toBeLessThan(0.01);
    expect(check('occupied-bandwidth').margin).toBeGreaterThan(0);
    // A single tone is no two-tone test: the intermodulation check says so instead of a margin.
    expect(check('intermodulation').problem).toMatch(/two equal audio tones/);
    expect(res.body.phasing.phaseErrorAloneDeg).toBeCloseTo(1, 0);
    expect(res.body.phasing.meetsRequirement).toBe(true);
    expect(await totals(orgs)).toEqual(before.rows);
    expect(await storedFiles(dataDir)).toEqual(before.files);
  });

  it('checks a trace against the sample mask about the given carrier, with its reference level', async () => {
    const m = await maker();
    // 47 CFR 87.139(c) sample (from memory): 4.5-7.5 kHz from the assigned frequency (carrier + 1400 Hz)
    // at least 38 dB below PEP: PEP 40 dBm -> 2 dBm; a 0 dBm line at carrier + 7000 Hz has 2 dB margin.
    const csv = traceCsv({ fromHz: -10_000, toHz: 10_000, stepHz: 10, floorDbm: -80, lines: [[1400, 37], [7000, 0]] });
    const res = await postFiles(t.app, '/precheck', m.auth, { file: { bytes: csv, name: 'mask.csv' }, fields: { ruleSetId: sampleIds['us-aviation-hf-ssb'], centerHz: CARRIER_HZ, referenceDbm: 40 } });
    expect(res.status).toBe(200);
    const mask = res.body.checks.find((c: { kind: string }) => c.kind === 'emission-mask');
    expect(mask.margin).toBeCloseTo(2, 10);
    expect(mask.mask.assignedHz).toBe(CARRIER_HZ + 1400);
    expect(res.body.checks.find((c: { kind: string }) => c.kind === 'occupied-bandwidth').problem).toMatch(/no occupied-bandwidth limit/);
    expect(res.body.phasing).toBeNull();
  });

  it('accepts only built-in sample rule sets, and refuses a trace without its carrier frequency', async () => {
    const m = await maker();
    const csv = traceCsv({ fromHz: -1000, toHz: 1000, stepHz: 10, floorDbm: -80, lines: [] });
    const own = await postFiles(t.app, '/precheck', m.auth, { file: { bytes: csv, name: 'a.csv' }, fields: { ruleSetId: '00000000-0000-4000-8000-000000000000', centerHz: CARRIER_HZ } });
    expect(own.status).toBe(422);
    expect(own.body.errors[0].pointer).toBe('/ruleSetId');
    const noCarrier = await postFiles(t.app, '/precheck', m.auth, { file: { bytes: csv, name: 'a.csv' }, fields: { ruleSetId: sampleIds['us-maritime-hf-ssb'] } });
    expect(noCarrier.status).toBe(422);
    expect(noCarrier.body.errors[0].pointer).toBe('/centerHz');
  });

  it('is size limited (413) and rate limited per person (429 with Retry-After)', async () => {
    const m = await maker();
    const big = await postFiles(t.app, '/precheck', m.auth, { file: { bytes: Buffer.alloc(1_000_001, 0x41), name: 'big.csv' }, fields: { ruleSetId: sampleIds['us-maritime-hf-ssb'] } });
    expect(big.status).toBe(413);
    for (let k = 1; k < PER_HOUR; k++) expect((await request(t.app).post('/api/precheck').set('Authorization', `Bearer ${m.auth.token}`).set('X-Organization-Id', m.auth.org).send({})).status).toBe(415);
    const limited = await request(t.app).post('/api/precheck').set('Authorization', `Bearer ${m.auth.token}`).set('X-Organization-Id', m.auth.org).send({});
    expect(limited.status).toBe(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(await storedFiles(dataDir)).toEqual([]);
  });

  it('is for manufacturers: a lab engineer is refused', async () => {
    const s = await buildLabScenario(t.sequelize);
    const { token } = await signIn(t.app, s.engineer.email);
    const res = await postFiles(t.app, '/precheck', { token, org: s.lab.id }, { file: { bytes: traceCsv({ fromHz: 0, toHz: 100, stepHz: 10, floorDbm: -80, lines: [] }), name: 'a.csv' }, fields: { ruleSetId: sampleIds['us-maritime-hf-ssb'] } });
    expect(res.status).toBe(403);
  });
});
