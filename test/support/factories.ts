/**
 * Test data builders: buildX(overrides) makes invented records through the system scope, each
 * with unique names so suites can share one database without interfering.
 */
import crypto from 'node:crypto';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import type { Express } from 'express';
import { Client, Device, Membership, Organization, RuleSet, TestCase, TestPlan, User } from '../../server/db/models';
import { asSystem } from '../../server/tenancy/tenant-transaction';
import { hashPassword } from '../../server/auth/password';
import type { Role } from '../../shared/access/roles';
import type { TestKind } from '../../shared/rules/test-kind';

export const TEST_PASSWORD = 'correct-horse-battery-42';
let passwordHash: Promise<string> | null = null;

/** `length` random characters of [0-9A-Z]. Six hex digits were too few: with the thousands of people
 * and organizations the API suites create in one database, two of them collided now and then. */
const unique = (length = 10) => Array.from(crypto.randomBytes(length), (b) => (b % 36).toString(36)).join('').toUpperCase();

export async function buildOrganization(sequelize: Sequelize, overrides: Partial<{ kind: 'lab' | 'manufacturer'; name: string }> = {}) {
  return asSystem(sequelize, (transaction) =>
    Organization.create(
      { kind: overrides.kind ?? 'lab', name: overrides.name ?? `Test lab ${unique()}`, code: `T${unique(7)}`, addressLines: ['1 Test Street', 'Testville'], settings: {} },
      { transaction },
    ),
  );
}

export async function buildUser(sequelize: Sequelize, organizationId: string | null, roles: Role[], overrides: Partial<{ email: string; displayName: string }> = {}) {
  passwordHash ??= hashPassword(TEST_PASSWORD);
  const hash = await passwordHash;
  return asSystem(sequelize, async (transaction) => {
    const id = unique().toLowerCase();
    const user = await User.create({ email: overrides.email ?? `person-${id}@test.example`, displayName: overrides.displayName ?? `Person ${id}`, passwordHash: hash }, { transaction });
    if (organizationId) for (const role of roles) await Membership.create({ organizationId, userId: user.id, role }, { transaction });
    return user;
  });
}

export async function signIn(app: Express, email: string, password = TEST_PASSWORD): Promise<{ token: string; cookie: string }> {
  const res = await request(app).post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`signIn(${email}) failed: ${res.status} ${JSON.stringify(res.body)}`);
  const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');
  return { token: res.body.accessToken, cookie };
}

/** A lab with one person per lab role, a client linked to a manufacturer org, a device and a one-case plan. */
export async function buildLabScenario(sequelize: Sequelize, options: { kinds?: TestKind[] } = {}) {
  const lab = await buildOrganization(sequelize, { kind: 'lab' });
  const maker = await buildOrganization(sequelize, { kind: 'manufacturer', name: `Test maker ${unique()}` });
  const admin = await buildUser(sequelize, lab.id, ['lab-admin']);
  const engineer = await buildUser(sequelize, lab.id, ['engineer']);
  const reviewer = await buildUser(sequelize, lab.id, ['reviewer']);
  const billing = await buildUser(sequelize, lab.id, ['billing']);
  const makerAdmin = await buildUser(sequelize, maker.id, ['manufacturer-admin']);
  const makerViewer = await buildUser(sequelize, maker.id, ['manufacturer-viewer']);
  const { client, device, plan, cases } = await asSystem(sequelize, async (transaction) => {
    const client = await Client.create({ organizationId: lab.id, clientOrganizationId: maker.id, name: maker.name, addressLines: ['2 Quay'], contactName: 'Contact Person', contactEmail: `contact-${unique().toLowerCase()}@maker.example` }, { transaction });
    const device = await Device.create({ organizationId: lab.id, clientId: client.id, manufacturer: maker.name, model: 'TX-1 test radio', serialNumber: `SN-${unique()}`, firmware: '1.0', ratedPepW: 100, emissionDesignator: '2K70J3E', frequencyMinHz: 1.6e6, frequencyMaxHz: 27.5e6, modes: ['USB', 'LSB'], receivedOn: '2026-11-01', condition: 'Good' }, { transaction });
    const ruleSet = (await RuleSet.findOne({ where: { organizationId: null, key: 'us-maritime-hf-ssb' }, transaction }))!;
    const plan = await TestPlan.create({ organizationId: lab.id, deviceId: device.id, ruleSetId: ruleSet.id, ruleSetSnapshot: { ...ruleSet.body, name: ruleSet.name, version: ruleSet.version } as TestPlan['ruleSetSnapshot'], name: 'Test plan' }, { transaction });
    const kinds = options.kinds ?? ['carrier-suppression'];
    const cases = [];
    for (const [i, kind] of kinds.entries()) {
      cases.push(await TestCase.create({ organizationId: lab.id, planId: plan.id, position: i + 1, kind, label: `Case ${i + 1}`, parameters: { frequencyHz: 2_182_000, sideband: 'USB' } }, { transaction }));
    }
    return { client, device, plan, cases };
  });
  return { lab, maker, admin, engineer, reviewer, billing, makerAdmin, makerViewer, client, device, plan, cases };
}
