/**
 * The daily calibration check against the real database and pg-boss queue: one e-mail per lab
 * administrator listing the instruments due within 30 days or overdue, and never the same
 * instrument and due date twice.
 */
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser } from '../../test/support/factories';
import { Instrument } from '../db/models';
import { asSystem, inTenant } from '../tenancy/tenant-transaction';
import { enqueueMail } from '../mail/mail-queue';
import { mailJobs } from '../billing/billing-stack.test-support';
import { addDaysIso, todayIso } from './calibration-status';
import { checkCalibrationDue } from './calibration-due-notices';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const deps = () => ({ sequelize: t.sequelize, publicUrl: 'http://127.0.0.1:4610', enqueueMail: (transaction: Parameters<typeof enqueueMail>[1], mail: Parameters<typeof enqueueMail>[2]) => enqueueMail(t.boss, transaction, mail) });

async function labWithInstruments(today: string) {
  const s = await buildLabScenario(t.sequelize);
  const instrument = (name: string, dueInDays: number) =>
    asSystem(t.sequelize, (transaction) =>
      Instrument.create({ organizationId: s.lab.id, name, model: 'M-1', serialNumber: `${name.slice(0, 2).toUpperCase()}-${s.lab.code}`, calibratedOn: addDaysIso(today, dueInDays - 365), calibrationDue: addDaysIso(today, dueInDays), certificateRef: 'CAL-1' }, { transaction }),
    );
  // 30 days is the window's edge (calibration-status.ts: due-soon when due ≤ today + 30), 31 is outside.
  const soon = await instrument('Power meter', 30);
  const overdue = await instrument('Spectrum analyser', -3);
  const valid = await instrument('Signal generator', 31);
  return { s, soon, overdue, valid };
}

const mailsOf = async (labName: string) => (await mailJobs(t, `at ${labName}`)).map((j) => j.data);

describe('checkCalibrationDue', () => {
  it('mails each lab administrator once, listing the due and overdue instruments with their dates, and not again on the next run', async () => {
    const today = todayIso();
    const { s, soon, overdue } = await labWithInstruments(today);
    const secondAdmin = await buildUser(t.sequelize, s.lab.id, ['lab-admin']);

    await checkCalibrationDue(deps(), today);
    const mails = await mailsOf(s.lab.name);
    expect(mails.map((m) => m.to).sort()).toEqual([s.admin.email, secondAdmin.email].sort());
    for (const m of mails) {
      expect(m.subject).toBe(`Calibration overdue at ${s.lab.name}: 2 instruments`);
      expect(m.text).toContain(`Power meter, M-1, s/n ${soon.serialNumber}: due ${addDaysIso(today, 30)}`);
      expect(m.text).toContain(`Spectrum analyser, M-1, s/n ${overdue.serialNumber}: overdue, was due ${addDaysIso(today, -3)}`);
      expect(m.text).not.toContain('Signal generator');
      expect(m.text).toContain('http://127.0.0.1:4610/equipment');
    }

    // Twice more, once of them concurrently: nothing new to say, nothing sent.
    await Promise.all([checkCalibrationDue(deps(), today), checkCalibrationDue(deps(), today)]);
    expect(await mailsOf(s.lab.name)).toHaveLength(2);
    const notices = await inTenant(t.sequelize, s.lab.id, (transaction) =>
      t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM calibration_notices', { type: QueryTypes.SELECT, transaction }),
    );
    expect(Number(notices[0].n)).toBe(2);
  });

  it('mails again for a new due date of the same instrument, and for an instrument coming into the window', async () => {
    const today = todayIso();
    const { s, soon, valid } = await labWithInstruments(today);
    await checkCalibrationDue(deps(), today);
    expect(await mailsOf(s.lab.name)).toHaveLength(1);
    // The next day the signal generator is 30 days out; the power meter was recalibrated with a new due date inside the window.
    await asSystem(t.sequelize, (transaction) => Instrument.update({ calibrationDue: addDaysIso(today, 20) }, { where: { id: soon.id }, transaction }));
    await checkCalibrationDue(deps(), addDaysIso(today, 1));
    const mails = await mailsOf(s.lab.name);
    expect(mails).toHaveLength(2);
    const second = mails.find((m) => m.subject.includes('2 instruments') && !m.text.includes('Spectrum analyser'))!;
    expect(second.text).toContain(`s/n ${soon.serialNumber}: due ${addDaysIso(today, 20)}`);
    expect(second.text).toContain(`s/n ${valid.serialNumber}: due ${addDaysIso(today, 31)}`);
  });

  it('keeps each lab’s notices to itself (row-level security on calibration_notices)', async () => {
    const today = todayIso();
    const a = await labWithInstruments(today);
    const b = await labWithInstruments(today);
    await checkCalibrationDue(deps(), today);
    const seenByA = await inTenant(t.sequelize, a.s.lab.id, (transaction) =>
      t.sequelize.query<{ organization_id: string }>('SELECT organization_id FROM calibration_notices', { type: QueryTypes.SELECT, transaction }),
    );
    expect(seenByA.length).toBe(2);
    expect(seenByA.every((r) => r.organization_id === a.s.lab.id)).toBe(true);
    expect((await mailsOf(b.s.lab.name)).map((m) => m.to)).toEqual([b.s.admin.email]);
  });
});
