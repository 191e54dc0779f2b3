import { startTestApp, type TestApp } from '../../test/support/test-app';
import { Organization } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { calibrationStatus } from '../instruments/calibration-status';
import { callerFor } from '../instruments/lab-session.test-support';
import { seedDemo } from './seed';
import { DEMO_LAB, DEMO_PASSWORD } from './demo-scenario';
import { DEMO_RUN_INSTRUMENT_SERIALS, demoInstruments } from './demo-instruments';

describe('demoInstruments', () => {
  it.each(['2026-12-01', '2028-02-29'])('seeded on %s: one due within 30 days, one overdue, the rest valid', (today) => {
    const statuses = demoInstruments(today).map((i) => calibrationStatus(i.calibrationDue, today));
    expect(statuses.filter((s) => s === 'due-soon')).toHaveLength(1);
    expect(statuses.filter((s) => s === 'overdue')).toHaveLength(1);
    expect(statuses.filter((s) => s === 'valid')).toHaveLength(3);
  });

  it('puts only instruments in calibration on the demo run', () => {
    const today = '2026-12-01';
    const used = demoInstruments(today).filter((i) => DEMO_RUN_INSTRUMENT_SERIALS.includes(i.serialNumber));
    expect(used.map((i) => calibrationStatus(i.calibrationDue, today))).toEqual(['valid', 'valid']);
  });
});

describe('the seeded demo lab', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await startTestApp();
    await seedDemo(t.sequelize);
  }, 60_000);
  afterAll(() => t?.close());

  it('has its register and a run on the bench that uses two of its instruments', async () => {
    const lab = (await asSystem(t.sequelize, (transaction) => Organization.findOne({ where: { code: DEMO_LAB.code }, transaction })))!;
    const engineer = await callerFor(t.app, { email: 'tomasz.ellery@kestrelbay.example' }, lab.id, DEMO_PASSWORD);
    const register = (await engineer('get', '/instruments')).body;
    expect(register.total).toBe(5);
    const statuses = register.items.map((i: { calibrationStatus: string }) => i.calibrationStatus).sort();
    expect(statuses).toEqual(['due-soon', 'overdue', 'valid', 'valid', 'valid']);
    const run = (await engineer('get', '/runs?state=testing')).body.items[0];
    const detail = (await engineer('get', `/runs/${run.id}`)).body;
    expect(detail.instruments.map((i: { serialNumber: string }) => i.serialNumber).sort()).toEqual([...DEMO_RUN_INSTRUMENT_SERIALS].sort());
  });
});
