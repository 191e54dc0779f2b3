import { startTestApp, type TestApp } from '../../test/support/test-app';
import { callerFor } from '../instruments/lab-session.test-support';
import { Organization } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { seedDemo } from './seed';
import { DEMO_LAB, DEMO_PASSWORD } from './demo-scenario';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await seedDemo(t.sequelize);
}, 60_000);
afterAll(() => t?.close());

describe('the demo run on the bench', () => {
  it('has an emission-mask and an I/Q unwanted-sideband case, and one invented trace upload that passes the mask', async () => {
    const lab = (await asSystem(t.sequelize, (transaction) => Organization.findOne({ where: { code: DEMO_LAB.code }, transaction })))!;
    const engineer = await callerFor(t.app, { email: 'tomasz.ellery@kestrelbay.example' }, lab.id, DEMO_PASSWORD);
    const run = (await engineer('get', '/runs?state=testing')).body.items[0];
    const detail = (await engineer('get', `/runs/${run.id}`)).body;
    const kinds = detail.testCases.map((c: { kind: string }) => c.kind);
    expect(kinds).toEqual(expect.arrayContaining(['emission-mask', 'unwanted-sideband']));
    const mask = detail.testCases.find((c: { kind: string }) => c.kind === 'emission-mask');
    // At least one: another suite seeding the shared test database at the same moment may add its own.
    expect(mask.uploads.length).toBeGreaterThanOrEqual(1);
    expect(mask.traceResult.verdict).toBe('pass');
    // The invented trace puts the upper 3rd-order product 36 dB below the two-tone PEP. Two equal
    // tones: PEP = tone + 6.02 dB, mean = tone + 3.01 dB (published), so the product is 32.99 dB
    // below mean power, against the 28 dB of 47 CFR 80.211(a) at 1900 Hz: 4.99 dB margin.
    expect(Math.abs(mask.traceResult.margin - (36 - 20 * Math.log10(2) + 10 * Math.log10(2) - 28))).toBeLessThan(0.3);
    expect(mask.traceResult.detail.mask.worstOffsetHz).toBeCloseTo(1900, -1);
    const file = await engineer('get', `/uploads/${mask.uploads.at(-1).id}/file`);
    expect(file.status).toBe(200);
    expect(file.text).toMatch(/^# Invented demo trace/);
    // Seeding again adds nothing.
    expect(await seedDemo(t.sequelize)).toEqual({ created: false });
    const again = (await engineer('get', `/runs/${run.id}/uploads`)).body;
    expect(again.total).toBe(mask.uploads.length);
  });
});
