import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { RuleSet } from '../db/models';
import { inTenant } from '../tenancy/tenant-transaction';
import type { RuleSetBody } from '../../shared/rules/rule-set';
import { callerFor } from '../instruments/lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

interface RuleSetRow {
  id: string;
  key: string;
  version: number;
  name: string;
  isSample: boolean;
  builtIn: boolean;
  body: RuleSetBody;
}

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  const engineer = await callerFor(t.app, s.engineer, s.lab.id);
  const samples = (await engineer('get', '/rule-sets?latest=true&pageSize=200')).body.items as RuleSetRow[];
  const maritime = samples.find((r) => r.builtIn && r.key === 'us-maritime-hf-ssb')!;
  const copy = async (name = `Our maritime rules ${Math.random().toString(36).slice(2, 7)}`) => (await engineer('post', `/rule-sets/${maritime.id}/copy`, { name })).body as RuleSetRow;
  return { s, engineer, maritime, copy };
}

const versionsOf = (organizationId: string, key: string) => inTenant(t.sequelize, organizationId, () => RuleSet.count({ where: { organizationId, key } }));
const withCarrierLimit = (body: RuleSetBody, minDbBelowPep: number): RuleSetBody => ({ ...body, limits: { ...body.limits, carrierSuppression: { minDbBelowPep, source: 'Lab rule, tightened for this client' } } });

describe('rule sets', () => {
  it('keeps the built-in samples read-only: editing one is refused with 409 and stores nothing', async () => {
    const { s, engineer, maritime } = await setup();
    const res = await engineer('put', `/rule-sets/${maritime.id}`, { body: withCarrierLimit(maritime.body, 50) });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('rule-set-read-only');
    expect(res.body.detail).toMatch(/copy/i);
    expect(await versionsOf(s.lab.id, maritime.key)).toBe(0);
    expect((await engineer('get', `/rule-sets/${maritime.id}`)).body.body.limits.carrierSuppression.minDbBelowPep).toBe(40);
  });

  it('copies a sample into the lab’s own rule set, version 1, no longer a sample', async () => {
    const { engineer, maritime } = await setup();
    const res = await engineer('post', `/rule-sets/${maritime.id}/copy`, { name: 'Kestrel maritime J3E, 2026' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ version: 1, isSample: false, builtIn: false, name: 'Kestrel maritime J3E, 2026', key: 'kestrel-maritime-j3e-2026' });
    expect(res.body.body.limits).toEqual(maritime.body.limits);
    expect(res.body.body.sampleNotice).toBeUndefined();
    // The same name again gets a key of its own.
    expect((await engineer('post', `/rule-sets/${maritime.id}/copy`, { name: 'Kestrel maritime J3E, 2026' })).body.key).toBe('kestrel-maritime-j3e-2026-2');
  });

  it('stores an edit as a new version with the same key and leaves the old version unchanged', async () => {
    const { s, engineer, copy } = await setup();
    const v1 = await copy();
    const res = await engineer('put', `/rule-sets/${v1.id}`, { name: 'Tightened', body: withCarrierLimit(v1.body, 50) });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ key: v1.key, version: 2, name: 'Tightened', isSample: false });
    expect(res.body.id).not.toBe(v1.id);
    expect((await engineer('get', `/rule-sets/${v1.id}`)).body).toMatchObject({ version: 1, name: v1.name, body: v1.body });

    const latest = (await engineer('get', `/rule-sets?latest=true&key=${v1.key}`)).body;
    expect(latest.items.map((r: RuleSetRow) => [r.version, r.id])).toEqual([[2, res.body.id]]);
    const every = (await engineer('get', `/rule-sets?key=${v1.key}&sort=-version`)).body;
    expect(every.items.map((r: RuleSetRow) => r.version)).toEqual([2, 1]);

    // Editing an old version is refused: the latest is where changes go.
    const stale = await engineer('put', `/rule-sets/${v1.id}`, { body: withCarrierLimit(v1.body, 45) });
    expect(stale.status).toBe(409);
    expect(stale.body.code).toBe('rule-set-not-latest');
    expect(await versionsOf(s.lab.id, v1.key)).toBe(2);

    const [entry] = (await t.sequelize.query("SELECT before, after FROM audit_log WHERE entity = 'rule-set' AND action = 'new-version' AND entity_id = :id", { replacements: { id: res.body.id } }))[0] as { before: RuleSetRow; after: RuleSetRow }[];
    expect(entry.before.body.limits.carrierSuppression!.minDbBelowPep).toBe(40);
    expect(entry.after.body.limits.carrierSuppression!.minDbBelowPep).toBe(50);
  });

  it('never changes a test already planned: a run made before the edit still evaluates with the old limit', async () => {
    const { s, engineer, copy } = await setup();
    const v1 = await copy();
    const planBody = (ruleSetId: string) => ({ deviceId: s.device.id, ruleSetId, name: 'Carrier check', testPoints: [{ kind: 'carrier-suppression', label: '2182 kHz', frequencyHz: 2_182_000, sideband: 'USB' }] });
    const oldPlan = (await engineer('post', '/plans', planBody(v1.id))).body;
    const oldRun = (await engineer('post', '/runs', { planId: oldPlan.id })).body;

    const v2 = (await engineer('put', `/rule-sets/${v1.id}`, { body: withCarrierLimit(v1.body, 50) })).body as RuleSetRow;
    const newPlan = (await engineer('post', '/plans', planBody(v2.id))).body;
    const newRun = (await engineer('post', '/runs', { planId: newPlan.id })).body;

    // 47 CFR 80.207(c): carrier at least 40 dB below PEP. PEP 50 dBm, carrier 4.5 dBm -> 45.5 dB (arithmetic).
    const values = { values: { pepDbm: 50, carrierDbm: 4.5 } };
    const before = await engineer('put', `/runs/${oldRun.id}/cases/${oldRun.testCases[0].id}/reading`, values);
    expect(before.body.result).toMatchObject({ limit: 40, verdict: 'pass' });
    const after = await engineer('put', `/runs/${newRun.id}/cases/${newRun.testCases[0].id}/reading`, values);
    expect(after.body.result).toMatchObject({ limit: 50, verdict: 'fail' });
    expect((await engineer('get', `/plans/${oldPlan.id}`)).body.ruleSet.limits.carrierSuppression.minDbBelowPep).toBe(40);
  });

  const maskOf = (vertices: unknown) => (body: RuleSetBody) => ({ body: { ...body, limits: { ...body.limits, emissionMask: { ...body.limits.emissionMask, vertices } } } });
  it.each([
    ['a mask vertex above the reference', '/body/limits/emissionMask/vertices/1/1', maskOf([[1500, 0], [1500, 2]])],
    ['a negative offset', '/body/limits/emissionMask/vertices/0/0', maskOf([[-1, 0], [1500, -28]])],
    ['decreasing offsets', '/body/limits/emissionMask/vertices/2/0', maskOf([[1500, 0], [4500, -28], [3000, -35]])],
    ['an unknown decision rule', '/body/decisionRule', (body: RuleSetBody) => ({ body: { ...body, decisionRule: { kind: 'majority-vote' } } })],
    ['an audio band upside down', '/body/limits/audioResponse/highHz', (body: RuleSetBody) => ({ body: { ...body, limits: { ...body.limits, audioResponse: { lowHz: 3000, highHz: 300, maxVariationDb: 6, source: 'x' } } } })],
    ['a missing body', '/body', () => ({ name: 'x' })],
    ['an unknown field', '/owner', (body: RuleSetBody) => ({ body, owner: 'me' })],
    ['a name too long', '/name', (body: RuleSetBody) => ({ body, name: 'x'.repeat(201) })],
    ['a budget row with an unknown distribution', '/body/uncertainty/relative/0/distribution', (body: RuleSetBody) => ({ body: { ...body, uncertainty: { ...body.uncertainty, relative: [{ name: 'x', distribution: 'lognormal', value: 1 }] } } })],
  ])('refuses an edit with %s: 422 naming %s, nothing stored', async (_what, pointer, make) => {
    const { s, engineer, copy } = await setup();
    const v1 = await copy();
    const res = await engineer('put', `/rule-sets/${v1.id}`, make(v1.body));
    expect(res.status).toBe(422);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    expect(await versionsOf(s.lab.id, v1.key)).toBe(1);
  });

  it.each([
    ['no name', {}],
    ['an empty name', { name: '' }],
    ['a name of 201 characters', { name: 'x'.repeat(201) }],
    ['an unknown field', { name: 'ok', key: 'mine' }],
  ])('refuses copying with %s (422)', async (_what, body) => {
    const { s, engineer, maritime } = await setup();
    expect((await engineer('post', `/rule-sets/${maritime.id}/copy`, body)).status).toBe(422);
    expect(await inTenant(t.sequelize, s.lab.id, () => RuleSet.count({ where: { organizationId: s.lab.id } }))).toBe(0);
  });

  it('keeps each lab’s rule sets to itself: another lab’s answers 404 to read, copy and edit', async () => {
    const a = await setup();
    const b = await setup();
    const theirs = await b.copy();
    expect((await a.engineer('get', `/rule-sets/${theirs.id}`)).status).toBe(404);
    expect((await a.engineer('post', `/rule-sets/${theirs.id}/copy`, { name: 'Borrowed' })).status).toBe(404);
    expect((await a.engineer('put', `/rule-sets/${theirs.id}`, { body: theirs.body })).status).toBe(404);
    expect((await a.engineer('get', '/rule-sets?pageSize=200')).body.items.map((r: RuleSetRow) => r.id)).not.toContain(theirs.id);
    expect(await versionsOf(b.s.lab.id, theirs.key)).toBe(1);
  });
});
