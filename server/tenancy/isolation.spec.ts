import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { Device } from '../db/models';
import { inTenant } from './tenant-transaction';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

describe('tenant isolation', () => {
  it('a lab never sees, and cannot address, another lab’s records (404, not 403)', async () => {
    const a = await buildLabScenario(t.sequelize);
    const b = await buildLabScenario(t.sequelize);
    const { token } = await signIn(t.app, a.engineer.email);
    const auth = (r: request.Test) => r.set('Authorization', `Bearer ${token}`).set('X-Organization-Id', a.lab.id);

    const list = await auth(request(t.app).get('/api/devices?pageSize=200'));
    expect(list.status).toBe(200);
    const ids = list.body.items.map((d: { id: string }) => d.id);
    expect(ids).toContain(a.device.id);
    expect(ids).not.toContain(b.device.id);

    const other = await auth(request(t.app).get(`/api/devices/${b.device.id}`));
    expect(other.status).toBe(404);
    expect(JSON.stringify(other.body)).not.toContain(b.device.serialNumber);

    // Naming the other lab as the active organization does not help either.
    const asOther = await request(t.app).get('/api/devices').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', b.lab.id);
    expect(asOther.status).toBe(404);

    // Building a plan on the other lab's device is refused as if it did not exist.
    const plan = await auth(request(t.app).post('/api/plans')).send({ deviceId: b.device.id, ruleSetId: a.plan.ruleSetId, name: 'x', testPoints: [{ kind: 'carrier-suppression', label: 'x', frequencyHz: 2e6, sideband: 'USB' }] });
    expect(plan.status).toBe(422);
  });

  it('is enforced by the database itself: outside a tenant transaction no tenant row is visible or writable', async () => {
    const a = await buildLabScenario(t.sequelize);
    const [{ n }] = await t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM devices', { type: QueryTypes.SELECT });
    expect(Number(n)).toBe(0);
    const inside = await inTenant(t.sequelize, a.lab.id, () => Device.count());
    expect(inside).toBe(1);
    await expect(
      inTenant(t.sequelize, a.lab.id, () => t.sequelize.query(`UPDATE devices SET organization_id = gen_random_uuid() WHERE id = :id`, { replacements: { id: a.device.id } })),
    ).rejects.toThrow(/row-level security|violates/);
  });

  it('the application role is not a superuser and cannot bypass row-level security', async () => {
    const [role] = await t.sequelize.query<{ rolsuper: boolean; rolbypassrls: boolean }>('SELECT rolsuper, rolbypassrls FROM pg_roles WHERE rolname = current_user', { type: QueryTypes.SELECT });
    expect(role).toEqual({ rolsuper: false, rolbypassrls: false });
  });
});
