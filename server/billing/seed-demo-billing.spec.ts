import { startTestApp, type TestApp } from '../../test/support/test-app';
import { seedDemo } from '../demo/seed';
import { DEMO_LAB, DEMO_PASSWORD, DEMO_PEOPLE } from '../demo/demo-scenario';
import { Organization } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { actingAs } from './billing-stack.test-support';

jest.setTimeout(60_000);
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  await seedDemo(t.sequelize);
});
afterAll(() => t?.close());

it('gives the demo manufacturer a price list and a starting balance of 3 credits at the demo lab', async () => {
  const [lab, maker] = await asSystem(t.sequelize, async () => [await Organization.findOne({ where: { code: DEMO_LAB.code } }), await Organization.findOne({ where: { code: 'HMRW' } })]);
  const buyer = DEMO_PEOPLE.find((p) => p.roles.includes('manufacturer-admin'))!;
  const as = await actingAs(t, buyer, maker!.id, DEMO_PASSWORD);
  const offers = (await as('get', '/billing/offers')).body.items;
  const atLab = offers.find((o: { lab: { id: string } }) => o.lab.id === lab!.id);
  // The invented demo prices of the brief: 1 credit GBP 180, 5 for 800, 20 for 2900 (pence).
  expect(atLab.packs.map((p: { credits: number; priceMinor: number; currency: string }) => [p.credits, p.priceMinor, p.currency])).toEqual([
    [1, 18_000, 'GBP'],
    [5, 80_000, 'GBP'],
    [20, 290_000, 'GBP'],
  ]);
  const ledger = (await as('get', '/billing/ledger')).body.items;
  expect(ledger.at(-1)).toMatchObject({ kind: 'adjustment', credits: 3, reason: 'demo starting balance', balanceAfter: 3 });
  // Seeding again changes nothing.
  expect(await seedDemo(t.sequelize)).toEqual({ created: false });
  expect((await as('get', '/billing/ledger')).body.total).toBe(ledger.length);
});
