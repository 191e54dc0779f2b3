/**
 * Uploads that must be refused: each answers 4xx (or a clear 5xx for a failing store) with a
 * problem that says why, and leaves NOTHING behind — no upload row, no result, and no file in
 * the storage folder (listed before and after), including the incoming folder.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { asSystem } from '../tenancy/tenant-transaction';
import { postFiles, sigmfPair, storedFiles, traceCsv, wavIq, type UploadPart } from './upload-files.test-support';

jest.setTimeout(60_000);
const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-refusals-'));
const MAX_BYTES = 2_000_000;
let t: TestApp;
let b: Awaited<ReturnType<typeof bench>>;

beforeAll(async () => {
  process.env.SIDECHECK_DATA_DIR = dataDir;
  process.env.SIDECHECK_UPLOAD_MAX_BYTES = String(MAX_BYTES);
  process.env.SIDECHECK_TRACE_MAX_BYTES = '200000';
  t = await startTestApp();
  b = await bench();
}, 60_000);
afterAll(async () => {
  await t?.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

async function bench() {
  const s = await buildLabScenario(t.sequelize, { kinds: ['emission-mask', 'unwanted-sideband'] });
  const { token } = await signIn(t.app, s.engineer.email);
  const run = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send({ planId: s.plan.id });
  const cases = run.body.testCases as { id: string; kind: string }[];
  const url = (kind: string) => `/runs/${run.body.id}/cases/${cases.find((c) => c.kind === kind)!.id}/uploads`;
  return { s, token, runId: run.body.id as string, url, auth: { token, org: s.lab.id } };
}

const counts = () =>
  asSystem(t.sequelize, async (transaction) => {
    const [row] = await t.sequelize.query<{ uploads: string; results: string }>('SELECT (SELECT count(*) FROM uploads WHERE run_id = :run) AS uploads, (SELECT count(*) FROM results WHERE run_id = :run) AS results', { replacements: { run: b.runId }, type: QueryTypes.SELECT, transaction });
    return { uploads: Number(row.uploads), results: Number(row.results) };
  });

/** Runs an upload and checks that it was refused with `status` and that nothing was stored. */
async function expectRefused(kind: string, parts: { file?: UploadPart; data?: UploadPart; fields?: Record<string, string | number> }, status: number, options: { url?: string; auth?: { token?: string; org?: string } } = {}) {
  const before = { rows: await counts(), files: await storedFiles(dataDir) };
  const res = await postFiles(t.app, options.url ?? b.url(kind), options.auth ?? b.auth, parts);
  expect({ status: res.status, body: res.body }).toMatchObject({ status });
  expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
  expect(await counts()).toEqual(before.rows);
  expect(await storedFiles(dataDir)).toEqual(before.files);
  return res.body as { detail: string; code: string; location?: { part: string; line?: number; column?: number; byteOffset?: number }; errors?: { pointer: string }[] };
}

const goodTrace = traceCsv({ fromHz: -8000, toHz: 8000, stepHz: 10, floorDbm: -90, lines: [[1000, 40]] });
const oneTone = { sampleRateHz: 48_000, sampleCount: 4096, sideband: 'usb' as const, tones: [{ audioHz: 1000, levelDbfs: -6 }] };

describe('mislabelled files (the type is read from the bytes) -> 415', () => {
  it('a CSV trace sent as format=wav', async () => {
    const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 'trace.csv' }, fields: { format: 'wav', referenceDbm: 40 } }, 415);
    expect(p.detail).toMatch(/contents are a spectrum trace \(CSV\), but the format field says a RIFF\/WAVE I\/Q recording/);
  });

  it('a WAV recording named trace.csv with Content-Type text/csv', async () => {
    const { bytes } = wavIq(oneTone, 'pcm16');
    const p = await expectRefused('unwanted-sideband', { file: { bytes, name: 'trace.csv', contentType: 'text/csv' } }, 415);
    expect(p.detail).toMatch(/RIFF\/WAVE I\/Q recording, but its name says a spectrum trace/);
  });

  it('headerless samples without a stated format, and a PNG picture', async () => {
    const { bytes } = wavIq(oneTone, 'float32');
    expect((await expectRefused('unwanted-sideband', { file: { bytes: bytes.subarray(44), name: 'capture.bin' } }, 415)).detail).toMatch(/format=cf32 or format=ci16/);
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect((await expectRefused('emission-mask', { file: { bytes: png, name: 'trace.csv', contentType: 'text/csv' } }, 415)).detail).toMatch(/no header/);
  });

  it('SigMF samples that are really a WAV file', async () => {
    const { meta } = await sigmfPair(oneTone);
    const { bytes } = wavIq(oneTone, 'float32');
    expect((await expectRefused('unwanted-sideband', { file: { bytes: meta, name: 'c.sigmf-meta' }, data: { bytes, name: 'c.sigmf-data' } }, 415)).detail).toMatch(/"data" part is a WAV file/);
  });

  it('a request that is not multipart', async () => {
    const res = await request(t.app).post(`/api${b.url('emission-mask')}`).set('Authorization', `Bearer ${b.token}`).set('X-Organization-Id', b.s.lab.id).send({ file: 'frequency_hz,level_dbm' });
    expect(res.status).toBe(415);
  });
});

describe('bad files -> 422 naming the line or byte offset', () => {
  it('a trace CSV with a bad number names its line and column', async () => {
    const bad = Buffer.from('frequency_hz,level_dbm\n2181000,-90\n2181010,-9O.5\n2181020,-90\n');
    const p = await expectRefused('emission-mask', { file: { bytes: bad, name: 'bad.csv' }, fields: { referenceDbm: 40 } }, 422);
    expect(p.code).toBe('import-failed');
    expect(p.location).toEqual({ part: 'file', line: 3, column: 2 });
    expect(p.detail).toMatch(/line 3, column 2: level "-9O.5" is not a number/);
  });

  it('a truncated SigMF dataset names the byte offset where the partial sample starts', async () => {
    const { meta, data } = await sigmfPair(oneTone);
    // cf32_le: 8 bytes per complex sample (SigMF specification); cutting 3 bytes leaves 5 of the
    // last sample, which starts at 8 x (4096 - 1) = 32760.
    const p = await expectRefused('unwanted-sideband', { file: { bytes: meta, name: 'c.sigmf-meta' }, data: { bytes: data.subarray(0, data.length - 3), name: 'c.sigmf-data' } }, 422);
    expect(p.location).toEqual({ part: 'data', byteOffset: 32_760 });
    expect(p.detail).toMatch(/truncated/);
  });

  it('SigMF metadata that is not JSON names its line and column', async () => {
    const { data } = await sigmfPair(oneTone);
    const meta = Buffer.from('{"global": {"core:version": "1.0.0",\n  "core:datatype": "cf32_le"\n  "core:sample_rate": 48000}, "captures": []}');
    const p = await expectRefused('unwanted-sideband', { file: { bytes: meta, name: 'c.sigmf-meta' }, data: { bytes: data, name: 'c.sigmf-data' } }, 422);
    expect(p.location).toMatchObject({ part: 'file', line: 3 });
  });

  it('a WAV header that lies about its sizes names the field (RIFF size at byte 4, data size at byte 40)', async () => {
    const { bytes } = wavIq(oneTone, 'pcm16');
    const riffLies = Buffer.from(bytes);
    riffLies.writeUInt32LE(bytes.length * 2, 4);
    expect((await expectRefused('unwanted-sideband', { file: { bytes: riffLies, name: 'c.wav' } }, 422)).location).toEqual({ part: 'file', byteOffset: 4 });
    const dataLies = Buffer.from(bytes);
    dataLies.writeUInt32LE(bytes.length * 2, 40);
    expect((await expectRefused('unwanted-sideband', { file: { bytes: dataLies, name: 'c.wav' } }, 422)).location).toEqual({ part: 'file', byteOffset: 40 });
  });

  it('an empty file, a capture of silence, and a SigMF pair without its samples', async () => {
    expect((await expectRefused('emission-mask', { file: { bytes: Buffer.alloc(0), name: 'empty.csv' } }, 422)).detail).toMatch(/empty/);
    const silence = wavIq({ ...oneTone, tones: [{ audioHz: 1000, levelDbfs: -200 }] }, 'pcm16').bytes;
    expect((await expectRefused('unwanted-sideband', { file: { bytes: silence, name: 'silence.wav' } }, 422)).code).toBe('analysis-failed');
    const { meta } = await sigmfPair(oneTone);
    expect((await expectRefused('unwanted-sideband', { file: { bytes: meta, name: 'c.sigmf-meta' } }, 422)).errors?.[0].pointer).toBe('/data');
  });
});

describe('names, fields and sizes', () => {
  it.each(['../../etc/passwd', '..\\..\\windows\\win.ini', 'traces/2182.csv'])('a file name with a folder in it (%j) -> 422, and nothing lands outside the store', async (name) => {
    const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name }, fields: { referenceDbm: 40 } }, 422);
    expect(p.errors?.[0].pointer).toBe('/file');
    expect(fs.existsSync(path.join(dataDir, '..', 'etc', 'passwd'))).toBe(false);
    expect((await storedFiles(dataDir)).some((f) => f.includes('passwd'))).toBe(false);
  });

  it('a control character in a part header is refused by the multipart reader -> 400', async () => {
    const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 'trace\u0007.csv' }, fields: { referenceDbm: 40 } }, 400);
    expect(p.detail).toMatch(/multipart body could not be read/);
  });

  it('a file larger than the limit -> 413, the partial file removed', async () => {
    const big = Buffer.alloc(MAX_BYTES + 1, 0x41);
    const p = await expectRefused('emission-mask', { file: { bytes: big, name: 'big.csv' } }, 413);
    expect(p.detail).toMatch(/larger than 2 MB/);
  });

  it('a trace CSV above the trace limit -> 413', async () => {
    const long = traceCsv({ fromHz: -20_000, toHz: 20_000, stepHz: 1, floorDbm: -90, lines: [] });
    expect(long.length).toBeGreaterThan(200_000);
    await expectRefused('emission-mask', { file: { bytes: long, name: 'long.csv' }, fields: { referenceDbm: 40 } }, 413);
  });

  it.each([
    [{ referenceDbm: 'forty' }, '/referenceDbm'],
    [{ referenceDbm: '1e300' }, '/referenceDbm'],
    [{ sideband: 'dsb' }, '/sideband'],
    [{ colour: 'red' }, '/colour'],
  ])('bad fields %j -> 422 at %s', async (fields, pointer) => {
    const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' }, fields }, 422);
    expect(p.errors?.map((e) => e.pointer)).toContain(pointer);
  });

  it('parameters that do not fit the file -> 422: a rate for a WAV, a full-scale level for a trace', async () => {
    const { bytes } = wavIq(oneTone, 'pcm16');
    expect((await expectRefused('unwanted-sideband', { file: { bytes, name: 'c.wav' }, fields: { sampleRateHz: 48_000 } }, 422)).errors?.[0].pointer).toBe('/sampleRateHz');
    expect((await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' }, fields: { fullScaleDbm: 50 } }, 422)).errors?.[0].pointer).toBe('/fullScaleDbm');
  });

  it('an unexpected file part -> 422', async () => {
    const res = await request(t.app).post(`/api${b.url('emission-mask')}`).set('Authorization', `Bearer ${b.token}`).set('X-Organization-Id', b.s.lab.id).attach('payload', goodTrace, 't.csv');
    expect(res.status).toBe(422);
    expect(await storedFiles(dataDir)).not.toContainEqual(expect.stringContaining('.incoming'));
  });
});

describe('uploads the case cannot take', () => {
  it('an emission-mask trace without the reference level, and an I/Q capture for a mask case -> 422', async () => {
    expect((await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' } }, 422)).detail).toMatch(/mean power in dBm \(referenceDbm\)/);
    const { bytes } = wavIq(oneTone, 'pcm16');
    expect((await expectRefused('emission-mask', { file: { bytes, name: 'c.wav' } }, 422)).detail).toMatch(/cannot be evaluated from an I\/Q capture/);
  });

  it('another lab’s run answers 404 and reads no file', async () => {
    const other = await buildLabScenario(t.sequelize);
    const { token } = await signIn(t.app, other.engineer.email);
    await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' }, fields: { referenceDbm: 40 } }, 404, { auth: { token, org: other.lab.id } });
  });

  it('a run that has left the bench -> 409', async () => {
    const s = await buildLabScenario(t.sequelize, { kinds: ['emission-mask'] });
    const { token } = await signIn(t.app, s.engineer.email);
    const as = (m: 'post' | 'get', url: string) => request(t.app)[m](`/api${url}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
    const run = await as('post', '/runs').send({ planId: s.plan.id });
    const url = `/runs/${run.body.id}/cases/${run.body.testCases[0].id}/uploads`;
    const first = await postFiles(t.app, url, { token, org: s.lab.id }, { file: { bytes: goodTrace, name: 't.csv' }, fields: { referenceDbm: 40 } });
    expect(first.status).toBe(201);
    // The trace-based result is enough to send the run for review (the case has a computed result).
    expect((await as('post', `/runs/${run.body.id}/submit`).send({})).status).toBe(200);
    const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' }, fields: { referenceDbm: 40 } }, 409, { url, auth: { token, org: s.lab.id } });
    expect(p.code).toBe('run-not-editable');
  });

  it('a store that cannot write answers a clear 500 and keeps nothing, not even the database rows', async () => {
    // A file where the organization's storage folder would go makes every write under it fail.
    const fresh = await bench();
    const blocker = path.join(dataDir, 'uploads', fresh.s.lab.id);
    fs.mkdirSync(path.dirname(blocker), { recursive: true });
    fs.writeFileSync(blocker, 'not a folder');
    try {
      const p = await expectRefused('emission-mask', { file: { bytes: goodTrace, name: 't.csv' }, fields: { referenceDbm: 40 } }, 500, { url: fresh.url('emission-mask'), auth: fresh.auth });
      expect(p.code).toBe('storage-failed');
      expect(p.detail).toMatch(/Nothing was stored/);
    } finally {
      fs.rmSync(blocker);
    }
  });
});
