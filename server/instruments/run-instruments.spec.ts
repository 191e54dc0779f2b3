import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { Reading, RunInstrument } from '../db/models';
import { inTenant } from '../tenancy/tenant-transaction';
import { SAMPLE_RULE_SETS } from '../../shared/rules/sample-rule-sets';
import { addDaysIso, todayIso } from './calibration-status';
import { callerFor, instrumentBody } from './lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

interface RunBody {
  id: string;
  state: string;
  testCases: { id: string; kind: string }[];
  instruments: { id: string; name: string; serialNumber: string; calibrationStatus: string }[];
}

async function setup() {
  const s = await buildLabScenario(t.sequelize, { kinds: ['carrier-suppression', 'frequency-tolerance'] });
  const engineer = await callerFor(t.app, s.engineer, s.lab.id);
  const run = (await engineer('post', '/runs', { planId: s.plan.id })).body as RunBody;
  const add = async (dueInDays: number, overrides = {}) => (await engineer('post', '/instruments', instrumentBody(dueInDays, overrides))).body as { id: string; name: string; serialNumber: string; calibrationDue: string };
  return { s, engineer, run, add };
}

const reading = (run: RunBody, kind: string) => `/runs/${run.id}/cases/${run.testCases.find((c) => c.kind === kind)!.id}/reading`;

describe('instruments used on a run', () => {
  it('sets the instruments of a run on the bench, lists them on the run and audits the change', async () => {
    const { s, engineer, run, add } = await setup();
    const analyser = await add(200, { name: 'Analyser A' });
    const counter = await add(15, { name: 'Counter B' });
    const res = await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [counter.id, analyser.id] });
    expect(res.status).toBe(200);
    expect(res.body.instruments.map((i: RunBody['instruments'][number]) => [i.name, i.calibrationStatus])).toEqual([['Analyser A', 'valid'], ['Counter B', 'due-soon']]);
    expect((await engineer('get', `/runs/${run.id}`)).body.instruments).toHaveLength(2);

    // Replacing the set keeps only the new one.
    const replaced = await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [analyser.id] });
    expect(replaced.body.instruments.map((i: { id: string }) => i.id)).toEqual([analyser.id]);
    const [rows] = await t.sequelize.query("SELECT before, after FROM audit_log WHERE entity_id = :id AND action = 'set-instruments' ORDER BY id", { replacements: { id: run.id } });
    expect(rows).toHaveLength(2);
    expect((rows[1] as { before: { instruments: unknown[] } }).before.instruments).toHaveLength(2);
    expect(await inTenant(t.sequelize, s.lab.id, () => RunInstrument.count({ where: { runId: run.id } }))).toBe(1);
  });

  it('refuses an instrument past its calibration due date with 409 naming it, and keeps the previous set', async () => {
    const { engineer, run, add } = await setup();
    const good = await add(100);
    await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [good.id] });
    const late = await add(-3, { name: 'Power sensor', serialNumber: 'PS-778' });
    const res = await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [good.id, late.id] });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('calibration-overdue');
    expect(res.body.detail).toContain(`Power sensor s/n PS-778 was due for calibration on ${addDaysIso(todayIso(), -3)}`);
    expect((await engineer('get', `/runs/${run.id}`)).body.instruments.map((i: { id: string }) => i.id)).toEqual([good.id]);
  });

  it('answers 422 for an instrument of another lab or none at all, naming each bad entry, and 404 for another lab’s run', async () => {
    const { engineer, run, add } = await setup();
    const other = await setup();
    const theirs = await other.add(100);
    const mine = await add(100);
    const res = await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [mine.id, theirs.id, '00000000-0000-4000-8000-000000000000'] });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/instrumentIds/1', '/instrumentIds/2']);
    expect((await engineer('put', `/runs/${other.run.id}/instruments`, { instrumentIds: [mine.id] })).status).toBe(404);
  });

  it.each([
    [{}, '/instrumentIds'],
    [{ instrumentIds: ['not-a-uuid'] }, '/instrumentIds/0'],
    [{ instrumentIds: 'x' }, '/instrumentIds'],
    [{ instrumentIds: [], extra: true }, '/extra'],
  ])('refuses the body %j with 422 at %s', async (body, pointer) => {
    const { engineer, run } = await setup();
    const res = await engineer('put', `/runs/${run.id}/instruments`, body);
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
  });

  it('adds each instrument contribution to the budget it is tagged for, and only to that one', async () => {
    const { engineer, run, add } = await setup();
    const instrument = await add(100, {
      contributions: [
        { name: 'Relative amplitude', distribution: 'normal', value: 0.3, coverageFactor: 2, budget: 'relative' },
        { name: 'Absolute amplitude', distribution: 'rectangular', value: 5, budget: 'absolute' },
        { name: 'Timebase', distribution: 'rectangular', value: 0.3, budget: 'frequencyHz' },
      ],
    });
    await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [instrument.id] });
    const sample = SAMPLE_RULE_SETS.find((r) => r.key === 'us-maritime-hf-ssb')!.body.uncertainty;
    // GUM JCGM 100:2008 §4.3.7 and §5.1.2: u = a/√3 (rectangular), U/k (normal); u_c = √Σu²; U = 2·u_c.
    const u = (c: { distribution: string; value: number; coverageFactor?: number }) => (c.distribution === 'rectangular' ? c.value / Math.sqrt(3) : c.value / (c.coverageFactor ?? 2));
    const expanded = (rows: { distribution: string; value: number; coverageFactor?: number }[]) => 2 * Math.sqrt(rows.reduce((sum, c) => sum + u(c) ** 2, 0));

    const carrier = await engineer('put', reading(run, 'carrier-suppression'), { values: { pepDbm: 50, carrierDbm: 4.5 } });
    expect(carrier.status).toBe(200);
    expect(carrier.body.result.expandedUncertainty).toBeCloseTo(expanded([...sample.relative, { distribution: 'normal', value: 0.3, coverageFactor: 2 }]), 10);
    const names = carrier.body.result.detail.budget.map((r: { name: string }) => r.name);
    expect(names).toContain(`Relative amplitude (${instrument.name} s/n ${instrument.serialNumber})`);
    expect(names.join()).not.toContain('Absolute amplitude');
    expect(carrier.body.result.detail.instruments).toEqual([expect.objectContaining({ id: instrument.id, certificateRef: expect.any(String) })]);

    const frequency = await engineer('put', reading(run, 'frequency-tolerance'), { values: { measuredHz: 2_182_004, nominalHz: 2_182_000 } });
    expect(frequency.body.result.expandedUncertainty).toBeCloseTo(expanded([...sample.frequencyHz!, { distribution: 'rectangular', value: 0.3 }]), 10);
  });

  it('refuses saving a reading, and submitting, once an assigned instrument has fallen overdue', async () => {
    const { s, engineer, run, add } = await setup();
    const instrument = await add(100, { name: 'Analyser C', serialNumber: 'AC-1' });
    await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [instrument.id] });
    expect((await engineer('put', reading(run, 'carrier-suppression'), { values: { pepDbm: 50, carrierDbm: 4.5 } })).status).toBe(200);
    expect((await engineer('put', reading(run, 'frequency-tolerance'), { values: { measuredHz: 2_182_004, nominalHz: 2_182_000 } })).status).toBe(200);

    // Time passes: the due date is now yesterday (set in the database, as the calendar would).
    const yesterday = addDaysIso(todayIso(), -1);
    await inTenant(t.sequelize, s.lab.id, () => t.sequelize.query('UPDATE instruments SET calibration_due = :d, calibrated_on = :c WHERE id = :id', { replacements: { d: yesterday, c: addDaysIso(yesterday, -365), id: instrument.id } }));

    const saved = await engineer('put', reading(run, 'carrier-suppression'), { values: { pepDbm: 50, carrierDbm: 5 } });
    expect(saved.status).toBe(409);
    expect(saved.body.detail).toContain(`Analyser C s/n AC-1 was due for calibration on ${yesterday}`);
    expect(await inTenant(t.sequelize, s.lab.id, () => Reading.count({ where: { runId: run.id } }))).toBe(2);

    const submitted = await engineer('post', `/runs/${run.id}/submit`);
    expect(submitted.status).toBe(409);
    expect(submitted.body.code).toBe('calibration-overdue');
    expect((await engineer('get', `/runs/${run.id}`)).body.state).toBe('testing');
  });

  it('refuses changing the instruments once the run has left the bench', async () => {
    const { engineer, run, add } = await setup();
    const instrument = await add(100);
    await engineer('put', reading(run, 'carrier-suppression'), { values: { pepDbm: 50, carrierDbm: 4.5 } });
    await engineer('put', reading(run, 'frequency-tolerance'), { values: { measuredHz: 2_182_004, nominalHz: 2_182_000 } });
    expect((await engineer('post', `/runs/${run.id}/submit`)).status).toBe(200);
    const res = await engineer('put', `/runs/${run.id}/instruments`, { instrumentIds: [instrument.id] });
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('run-not-editable');
  });
});
