/**
 * Uploads of traces and I/Q captures, end to end through the real app and database: real
 * multipart requests of files made here with known truth, the stored file read back byte for
 * byte, the figures checked against the synthesizer's truth (within 0.3 dB) or published
 * relations, and the result linked to its upload.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { asSystem } from '../tenancy/tenant-transaction';
import { imageRejectionDb } from '../../shared/phasing/image-rejection';
import { belowCrestDb, CARRIER_HZ, postFiles, rawIq, sigmfPair, storedFiles, traceCsv, wavIq } from './upload-files.test-support';

jest.setTimeout(60_000);
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-uploads-'));
let t: TestApp;
beforeAll(async () => {
  process.env.SIDECHECK_DATA_DIR = dataDir;
  process.env.SIDECHECK_UPLOAD_MAX_BYTES = '20000000';
  t = await startTestApp();
}, 60_000);
afterAll(async () => {
  await t?.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

const KINDS = ['emission-mask', 'unwanted-sideband', 'intermodulation', 'carrier-suppression', 'occupied-bandwidth'] as const;

async function bench() {
  const s = await buildLabScenario(t.sequelize, { kinds: [...KINDS] });
  const { token } = await signIn(t.app, s.engineer.email);
  const run = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send({ planId: s.plan.id });
  expect(run.status).toBe(201);
  const caseOf = (kind: (typeof KINDS)[number]) => (run.body.testCases as { id: string; kind: string }[]).find((c) => c.kind === kind)!.id;
  const get = (url: string) => request(t.app).get(`/api${url}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
  const auth = { token, org: s.lab.id };
  return { s, token, auth, get, runId: run.body.id as string, caseOf, url: (kind: (typeof KINDS)[number]) => `/runs/${run.body.id}/cases/${caseOf(kind)}/uploads` };
}

const sha256 = (bytes: Buffer) => crypto.createHash('sha256').update(bytes).digest('hex');
const system = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
  asSystem(t.sequelize, (transaction) => t.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction }));

describe('an emission-mask trace', () => {
  // Two tones of 44 dBm: mean power = n·Pt = 44 + 10 log10 2 = 47.01 dBm (n equal tones, published).
  // Tones at 700 and 1300 Hz (within 50 % of the 3.0 kHz authorized bandwidth: not compared),
  // their upper 3rd-order product at 2·1300 − 700 = 1900 Hz (common practice), a line at 5000 Hz.
  const MEAN_DBM = 44 + 10 * Math.log10(2);
  const csv = traceCsv({ fromHz: -10_000, toHz: 10_000, stepHz: 1, floorDbm: -100, lines: [[700, 44], [1300, 44], [1900, 14], [5000, 5]] });

  it('is stored unchanged with its SHA-256, checked against the 47 CFR 80.211(a) mask, and plotted thinned', async () => {
    const b = await bench();
    const res = await postFiles(t.app, b.url('emission-mask'), b.auth, { file: { bytes: csv, name: 'HX150 2182 kHz mask.csv', contentType: 'text/csv' }, fields: { referenceDbm: MEAN_DBM.toFixed(4) } });
    expect(res.status).toBe(201);
    const u = res.body;
    expect(u).toMatchObject({ format: 'trace-csv', file: { name: 'HX150 2182 kHz mask.csv', sizeBytes: csv.length, sha256: sha256(csv) }, data: null });
    // 47 CFR 80.211(a), authorized bandwidth 3.0 kHz: 1900 Hz from the assigned frequency lies in the
    // 50-150 % region, at least 28 dB below mean power: limit 47.01 - 28 = 19.01 dBm; the 14 dBm product
    // there has 5.01 dB margin, less than the 5000 Hz line (35 dB region: 12.01 dBm limit, 7.01 dB).
    expect(u.result.verdict).toBe('pass');
    expect(u.result.value).toBe(14);
    expect(u.result.limit).toBeCloseTo(MEAN_DBM - 28, 3);
    expect(u.result.margin).toBeCloseTo(MEAN_DBM - 28 - 14, 3);
    expect(u.result.detail.mask.worstFrequencyHz).toBe(CARRIER_HZ + 1900);
    expect(u.result.detail.limitText).toMatch(/47 CFR 80\.211\(a\)/);
    // 99 % of the power lies between the two tones' outer skirts: at least their 600 Hz spacing.
    expect(u.result.detail.inputs.occupiedBandwidthHz).toBeGreaterThanOrEqual(600);
    expect(u.result.detail.inputs.occupiedBandwidthHz).toBeLessThan(1800);
    expect(u.result.expandedUncertainty).toBeGreaterThan(0);
    expect(u.result.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    // 20 001 points thinned to at most 4000, the peaks kept (min/max per bucket).
    expect(u.analysis.pointCount).toBe(20_001);
    expect(u.analysis.plot.x.length).toBeLessThanOrEqual(4000);
    expect(Math.max(...u.analysis.plot.y)).toBe(44);
    expect(u.analysis.peak.levelDbm).toBe(44);
    expect(u.result.detail.limitLine.upper.x[0]).toBe(CARRIER_HZ + 1500);

    const file = await b.get(`/uploads/${u.id}/file`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(file.status).toBe(200);
    expect(Buffer.compare(file.body as Buffer, csv)).toBe(0);
    // RFC 9530 Repr-Digest: sha-256 of the representation, base64 between colons.
    expect(file.headers['repr-digest']).toBe(`sha-256=:${crypto.createHash('sha256').update(csv).digest('base64')}:`);
    expect(await storedFiles(path.join(dataDir, 'uploads'))).toContain(path.join(b.s.lab.id, u.id, 'file'));

    const detail = await b.get(`/uploads/${u.id}`);
    expect(detail.body.result.id).toBe(u.result.id);
    const list = await b.get(`/runs/${b.runId}/uploads?testCaseId=${b.caseOf('emission-mask')}`);
    expect(list.body).toMatchObject({ total: 1, items: [{ id: u.id, result: { verdict: 'pass' } }] });
    const run = await b.get(`/runs/${b.runId}`);
    const maskCase = run.body.testCases.find((c: { kind: string }) => c.kind === 'emission-mask');
    expect(maskCase.uploads.map((x: { id: string }) => x.id)).toEqual([u.id]);
    expect(maskCase.traceResult).toMatchObject({ id: u.result.id, uploadId: u.id, verdict: 'pass' });
    const [row] = await system<{ upload_id: string; reading_id: string | null }>('SELECT upload_id, reading_id FROM results WHERE id = :id', { id: u.result.id });
    expect(row).toEqual({ upload_id: u.id, reading_id: null });
    // The analysis (tens of kilobytes of JSON) is stored compressed with LZ4 (migration 0011) and reads back whole.
    const [stored] = await system<{ method: string; stored_bytes: number; text_bytes: number }>(
      'SELECT pg_column_compression(analysis) AS method, pg_column_size(analysis) AS stored_bytes, octet_length(analysis::text) AS text_bytes FROM uploads WHERE id = :id',
      { id: u.id },
    );
    expect(stored.method).toBe('lz4');
    expect(stored.stored_bytes).toBeLessThan(stored.text_bytes / 2);
    expect(detail.body.analysis).toEqual(u.analysis);
  });

  it('the uploaded file is a technical record: the database refuses to change or delete it', async () => {
    const b = await bench();
    // An analyzer export may open with a long comment block: the type is still read from the bytes.
    const preamble = Buffer.from(Array.from({ length: 40 }, (_, k) => `# instrument setting ${k}: as used on the bench\n`).join(''));
    expect(preamble.length).toBeGreaterThan(512);
    const res = await postFiles(t.app, b.url('occupied-bandwidth'), b.auth, { file: { bytes: Buffer.concat([preamble, csv]), name: 'obw.csv' } });
    expect(res.status).toBe(201);
    expect(res.body.result.unit).toBe('Hz');
    await expect(asSystem(t.sequelize, (transaction) => t.sequelize.query('DELETE FROM uploads WHERE id = :id', { replacements: { id: res.body.id }, transaction }))).rejects.toThrow(/immutable/);
  });
});

describe('reading uploads back', () => {
  it('lists a run’s uploads paginated and sorted on the server; another lab gets 404 for every upload route', async () => {
    const b = await bench();
    const csv = traceCsv({ fromHz: -5000, toHz: 5000, stepHz: 10, floorDbm: -90, lines: [[1000, 30]] });
    for (const name of ['b-second.csv', 'a-first.csv']) {
      expect((await postFiles(t.app, b.url('occupied-bandwidth'), b.auth, { file: { bytes: csv, name } })).status).toBe(201);
    }
    const page1 = await b.get(`/runs/${b.runId}/uploads?sort=fileName&pageSize=1`);
    expect(page1.body).toMatchObject({ total: 2, page: 1, pageSize: 1, items: [{ file: { name: 'a-first.csv' }, result: { verdict: 'pass' } }] });
    const page2 = await b.get(`/runs/${b.runId}/uploads?sort=fileName&pageSize=1&page=2`);
    expect(page2.body.items[0].file.name).toBe('b-second.csv');
    expect((await b.get(`/runs/${b.runId}/uploads?sort=colour`)).status).toBe(400);
    expect((await b.get(`/runs/${b.runId}/uploads?format=wav`)).body.total).toBe(0);

    const other = await buildLabScenario(t.sequelize);
    const { token } = await signIn(t.app, other.engineer.email);
    const asOther = (url: string) => request(t.app).get(`/api${url}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', other.lab.id);
    const id = page1.body.items[0].id;
    expect((await asOther(`/uploads/${id}`)).status).toBe(404);
    expect((await asOther(`/uploads/${id}/file`)).status).toBe(404);
    expect((await asOther(`/runs/${b.runId}/uploads`)).status).toBe(404);
    expect((await b.get(`/uploads/${id}/file?part=data`)).status).toBe(404); // a trace has no data part
    expect((await b.get('/uploads/not-a-uuid')).status).toBe(404);
  });
});

describe('I/Q captures', () => {
  it('a SigMF pair: every figure within 0.3 dB of the synthesizer, and a failing unwanted sideband explained by the phasing diagnosis', async () => {
    const b = await bench();
    // One 1 kHz tone with a 2° quadrature error: IRR = cot²(1°) = 35.16 dB (phasing relation, published),
    // short of the 40 dB of the maritime sample (ITU-R M.1173, from memory).
    const { meta, data, truth } = await sigmfPair({ sampleRateHz: 48_000, sampleCount: 96_000, sideband: 'usb', tones: [{ audioHz: 1000, levelDbfs: -6 }], phaseErrorDeg: 2, carrierLeakBelowPepDb: 45, noise: { powerDbfs: -95, seed: 7 } });
    const res = await postFiles(t.app, b.url('unwanted-sideband'), b.auth, { file: { bytes: meta, name: 'capture.sigmf-meta' }, data: { bytes: data, name: 'capture.sigmf-data' }, fields: { fullScaleDbm: 50 } });
    expect(res.status).toBe(201);
    const u = res.body;
    expect(u.format).toBe('sigmf');
    expect(u.data).toMatchObject({ sizeBytes: data.length, sha256: sha256(data) });
    expect(u.analysis).toMatchObject({ sampleRateHz: 48_000, sampleCount: 96_000, centerHz: CARRIER_HZ, datatype: 'cf32_le' });
    const f = u.analysis.figures;
    expect(Math.abs(f.unwantedSidebandSuppressionDb - truth.imageRejectionDb)).toBeLessThan(0.3);
    expect(Math.abs(truth.imageRejectionDb - imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 2 }))).toBeLessThan(1e-6);
    expect(Math.abs(f.carrierSuppressionDb - belowCrestDb(truth, truth.carrierPowerLinear))).toBeLessThan(0.3);
    expect(Math.abs(f.pepDbfs - 10 * Math.log10(truth.pepLinear))).toBeLessThan(0.3);
    expect(f.pepDbm).toBeCloseTo(f.pepDbfs + 50, 10);
    expect(u.analysis.plot.x.length).toBeLessThanOrEqual(4000);
    expect(u.result.verdict).toBe('fail');
    expect(u.result.limit).toBe(40);
    // The diagnosis: 35.16 dB is what 2° alone would give (small-error relation, common practice).
    expect(u.result.detail.phasing.phaseErrorAloneDeg).toBeCloseTo(2, 0);
    expect(u.result.detail.phasing.meetsRequirement).toBe(false);
    const dataFile = await b.get(`/uploads/${u.id}/file?part=data`).buffer(true).parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(sha256(dataFile.body as Buffer)).toBe(sha256(data));
  });

  it('raw ci16 with its stated rate decides carrier suppression against 47 CFR 80.207(c)', async () => {
    const b = await bench();
    const { bytes, truth } = rawIq({ sampleRateHz: 48_000, sampleCount: 48_000, sideband: 'usb', tones: [{ audioHz: 1100, levelDbfs: -12 }, { audioHz: 1700, levelDbfs: -12 }], carrierLeakBelowPepDb: 43, noise: { powerDbfs: -90, seed: 3 } }, 'ci16_le');
    const res = await postFiles(t.app, b.url('carrier-suppression'), b.auth, { file: { bytes, name: 'bench.ci16' }, fields: { format: 'ci16', sampleRateHz: 48_000 } });
    expect(res.status).toBe(201);
    expect(Math.abs(res.body.result.value - belowCrestDb(truth, truth.carrierPowerLinear))).toBeLessThan(0.3);
    expect(res.body.result.limit).toBe(40);
    expect(res.body.result.verdict).toBe('pass');
  });

  it('a 1.92 M-sample WAV capture is analysed in the request without stalling the server, IMD within 0.3 dB', async () => {
    const b = await bench();
    // 10 s at 192 kS/s, two tones, IMD3 32 dB and IMD5 44 dB below PEP.
    const { bytes, truth } = wavIq({ sampleRateHz: 192_000, sampleCount: 1_920_000, sideband: 'usb', tones: [{ audioHz: 1100, levelDbfs: -12 }, { audioHz: 1700, levelDbfs: -12 }], intermod: [{ order: 3, belowPepDb: 32 }, { order: 5, belowPepDb: 44 }], noise: { powerDbfs: -90, seed: 11 } }, 'pcm16');
    let worstGapMs = 0;
    let last = performance.now();
    const ticker = setInterval(() => {
      const now = performance.now();
      worstGapMs = Math.max(worstGapMs, now - last);
      last = now;
    }, 5);
    const started = performance.now();
    const res = await postFiles(t.app, b.url('intermodulation'), b.auth, { file: { bytes, name: 'two-tone.wav', contentType: 'audio/wav' } });
    clearInterval(ticker);
    const tookMs = performance.now() - started;
    expect(res.status).toBe(201);
    expect(res.body.analysis.sampleCount).toBe(1_920_000);
    const strongest = (order: number) => Math.max(...truth.intermodProducts.filter((p) => p.order === order).map((p) => p.powerLinear));
    expect(Math.abs(res.body.analysis.figures.imd3Db - belowCrestDb(truth, strongest(3)))).toBeLessThan(0.3);
    expect(Math.abs(res.body.analysis.figures.imd5Db - belowCrestDb(truth, strongest(5)))).toBeLessThan(0.3);
    expect(res.body.result.detail.inputs.decidingOrder).toBe(3);
    // The analysis reads 1 MiB at a time with an await between reads, so timers keep running: no
    // single stretch of work takes a large part of the request (analysed in one go, it would be most
    // of it). Relative, so a busy machine slows both alike.
    console.log(`1.92 M samples (${(bytes.length / 1e6).toFixed(1)} MB): ${tookMs.toFixed(0)} ms, longest event-loop gap ${worstGapMs.toFixed(0)} ms`);
    expect(worstGapMs).toBeLessThan(0.4 * tookMs);
    expect(worstGapMs).toBeLessThan(1000);
  });

  it('a bench script uploads with the lab’s API key', async () => {
    const b = await bench();
    const { token: adminToken } = await signIn(t.app, b.s.admin.email);
    const key = await request(t.app).post('/api/api-keys').set('Authorization', `Bearer ${adminToken}`).set('X-Organization-Id', b.s.lab.id).send({ name: 'Bench 2 analyzer' });
    expect(key.status).toBe(201);
    const csv = traceCsv({ fromHz: -10_000, toHz: 10_000, stepHz: 10, floorDbm: -100, lines: [[1100, 30]] });
    const res = await postFiles(t.app, b.url('emission-mask'), { apiKey: key.body.key }, { file: { bytes: csv, name: 'auto.csv' }, fields: { referenceDbm: 30 } });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ viaApiKey: true, uploadedBy: null });
    const [row] = await system<{ api_key_id: string }>('SELECT api_key_id FROM uploads WHERE id = :id', { id: res.body.id });
    expect(row.api_key_id).toBe(key.body.id);
    const [entry] = await system<{ api_key_id: string; action: string }>("SELECT api_key_id, action FROM audit_log WHERE entity = 'upload' AND entity_id = :id", { id: res.body.id });
    expect(entry).toEqual({ api_key_id: key.body.id, action: 'upload' });
  });
});
