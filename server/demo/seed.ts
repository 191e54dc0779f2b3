/**
 * Load the built-in sample rule sets (always) and the invented demo scenario (once). Idempotent:
 * running it again changes nothing that exists.
 */
import type { Sequelize } from 'sequelize';
import { Client, Device, Instrument, Membership, Organization, RuleSet, RunInstrument, TestCase, TestPlan, TestRun, User } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { seedDemoBilling } from '../billing/seed-demo-billing';
import { hashPassword } from '../auth/password';
import { SAMPLE_RULE_SETS } from '../../shared/rules/sample-rule-sets';
import { DEMO_DEVICES, DEMO_LAB, DEMO_MANUFACTURER, DEMO_PASSWORD, DEMO_PEOPLE } from './demo-scenario';
import { DEMO_RUN_INSTRUMENT_SERIALS, demoInstruments } from './demo-instruments';
import { todayIso } from '../instruments/calibration-status';
import { ensureDemoTraceUpload } from './demo-trace-upload';

export async function ensureBuiltInRuleSets(sequelize: Sequelize): Promise<number> {
  return asSystem(sequelize, async (transaction) => {
    let added = 0;
    for (const sample of SAMPLE_RULE_SETS) {
      const exists = await RuleSet.findOne({ where: { organizationId: null, key: sample.key, version: sample.version }, transaction });
      if (exists) continue;
      await RuleSet.create({ organizationId: null, key: sample.key, version: sample.version, name: sample.name, service: sample.body.service, isSample: true, body: sample.body }, { transaction });
      added++;
    }
    return added;
  });
}

export async function seedDemo(sequelize: Sequelize): Promise<{ created: boolean }> {
  await ensureBuiltInRuleSets(sequelize);
  const outcome = await asSystem(sequelize, async (transaction) => {
    // Two processes seeding at once (API test files in parallel, two servers starting together)
    // would both find no demo lab and both create it: the second waits here, then finds it.
    await sequelize.query("SELECT pg_advisory_xact_lock(hashtext('sidecheck:seed-demo'))", { transaction });
    if (await Organization.findOne({ where: { code: DEMO_LAB.code }, transaction })) return { created: false };
    const lab = await Organization.create({ kind: 'lab', ...DEMO_LAB }, { transaction });
    const maker = await Organization.create({ kind: 'manufacturer', ...DEMO_MANUFACTURER }, { transaction });
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const people: Record<string, User> = {};
    for (const p of DEMO_PEOPLE) {
      const user = await User.create({ email: p.email, displayName: p.displayName, passwordHash }, { transaction });
      people[p.email] = user;
      for (const role of p.roles) {
        await Membership.create({ organizationId: p.org === 'lab' ? lab.id : maker.id, userId: user.id, role }, { transaction });
      }
    }
    const client = await Client.create(
      { organizationId: lab.id, clientOrganizationId: maker.id, name: maker.name, addressLines: maker.addressLines, contactName: 'Delphine Okafor', contactEmail: 'delphine.okafor@halyard-radio.example' },
      { transaction },
    );
    await seedDemoBilling({ labId: lab.id, clientId: client.id, byUserId: people['imogen.varga@kestrelbay.example'].id }, transaction);
    const maritime = (await RuleSet.findOne({ where: { organizationId: null, key: 'us-maritime-hf-ssb' }, transaction }))!;
    const engineer = people['tomasz.ellery@kestrelbay.example'];
    const instruments = [];
    for (const i of demoInstruments(todayIso())) instruments.push(await Instrument.create({ ...i, organizationId: lab.id }, { transaction }));
    let runNumber = 0;
    for (const [i, d] of DEMO_DEVICES.entries()) {
      const device = await Device.create({ ...d, organizationId: lab.id, clientId: client.id, condition: 'As received, no visible damage' }, { transaction });
      const plan = await TestPlan.create(
        { organizationId: lab.id, deviceId: device.id, ruleSetId: maritime.id, ruleSetSnapshot: { ...maritime.body, name: maritime.name, version: maritime.version, key: maritime.key } as TestPlan['ruleSetSnapshot'], name: `${d.model.split(' ').slice(0, 2).join(' ')} type test` },
        { transaction },
      );
      const points = [
        { kind: 'carrier-suppression' as const, label: '2182 kHz, full power', frequencyHz: 2_182_000 },
        { kind: 'carrier-suppression' as const, label: '8291 kHz, full power', frequencyHz: 8_291_000 },
        // Judged from uploads: a spectrum-analyzer trace, and an I/Q capture of a 1 kHz tone.
        { kind: 'emission-mask' as const, label: '2182 kHz, two-tone mask (trace)', frequencyHz: 2_182_000 },
        { kind: 'unwanted-sideband' as const, label: '2182 kHz, 1 kHz tone (I/Q capture)', frequencyHz: 2_182_000 },
      ];
      for (const [position, p] of points.entries()) {
        await TestCase.create({ organizationId: lab.id, planId: plan.id, position: position + 1, kind: p.kind, label: p.label, parameters: { frequencyHz: p.frequencyHz, sideband: 'USB', powerLevel: 'Full rated PEP' } }, { transaction });
      }
      if (i === 0) {
        runNumber++;
        const run = await TestRun.create({ organizationId: lab.id, planId: plan.id, number: `RUN-${String(runNumber).padStart(6, '0')}`, state: 'testing', engineerId: engineer.id, testedFrom: '2026-11-24' }, { transaction });
        for (const used of instruments.filter((x) => DEMO_RUN_INSTRUMENT_SERIALS.includes(x.serialNumber))) {
          await RunInstrument.create({ organizationId: lab.id, runId: run.id, instrumentId: used.id, assignedBy: engineer.id }, { transaction });
        }
      }
    }
    await sequelize.query("INSERT INTO org_counters (organization_id, name, value) VALUES (:org, 'run', :n)", { replacements: { org: lab.id, n: runNumber }, transaction });
    return { created: true };
  });
  // The run on the bench gets its invented trace upload once the demo records are committed.
  await ensureDemoTraceUpload(sequelize);
  return outcome;
}
