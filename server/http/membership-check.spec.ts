import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { Membership } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

test('a member removed from the organization loses access at once, while the access token is still valid', async () => {
  const s = await buildLabScenario(t.sequelize);
  const { token } = await signIn(t.app, s.engineer.email);
  const get = () => request(t.app).get('/api/devices').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
  expect((await get()).status).toBe(200);
  await asSystem(t.sequelize, (transaction) => Membership.destroy({ where: { userId: s.engineer.id, organizationId: s.lab.id }, transaction }));
  expect((await get()).status).toBe(404);
});

test('a role taken away stops the actions of that role at once', async () => {
  const s = await buildLabScenario(t.sequelize);
  const { token } = await signIn(t.app, s.engineer.email);
  await asSystem(t.sequelize, async (transaction) => {
    await Membership.destroy({ where: { userId: s.engineer.id, organizationId: s.lab.id }, transaction });
    await Membership.create({ userId: s.engineer.id, organizationId: s.lab.id, role: 'billing' }, { transaction });
  });
  const res = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send({ planId: s.plan.id });
  expect(res.status).toBe(403);
});
