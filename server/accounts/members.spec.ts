import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser } from '../../test/support/factories';
import { callerFor } from './api-caller.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const rolesOf = async (organizationId: string, userId: string) =>
  (await t.sequelize.query<{ role: string }>('SELECT role FROM memberships WHERE organization_id = :organizationId AND user_id = :userId ORDER BY role', { replacements: { organizationId, userId }, type: QueryTypes.SELECT })).map((r) => r.role);

describe('members of the active organization', () => {
  it('lists the lab’s members with their roles, paginated, filtered and sorted', async () => {
    const s = await buildLabScenario(t.sequelize);
    const engineer = await callerFor(t.app, s.engineer, s.lab.id);
    const all = await engineer('get', '/members?sort=email');
    expect(all.status).toBe(200);
    expect(all.body.total).toBe(4);
    const emails = all.body.items.map((m: { email: string }) => m.email);
    expect(emails).toEqual([...emails].sort());
    expect(all.body.items).toContainEqual(expect.objectContaining({ userId: s.reviewer.id, name: s.reviewer.displayName, roles: ['reviewer'] }));
    // Nobody of the manufacturer or of another lab appears.
    expect(emails).not.toContain(s.makerAdmin.email);
    const reviewers = await engineer('get', '/members?role=reviewer');
    expect(reviewers.body.items.map((m: { userId: string }) => m.userId)).toEqual([s.reviewer.id]);
    const paged = await engineer('get', '/members?pageSize=3&page=2');
    expect(paged.body).toMatchObject({ total: 4, page: 2, pageSize: 3 });
    expect(paged.body.items).toHaveLength(1);
    expect((await engineer('get', '/members?role=owner')).status).toBe(400);
    expect((await engineer('get', '/members?sort=password_hash')).status).toBe(400);
  });

  it('lets the lab admin change roles, with lab roles only, audited', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const res = await admin('put', `/members/${s.engineer.id}/roles`, { roles: ['engineer', 'reviewer'] });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ userId: s.engineer.id, roles: ['engineer', 'reviewer'] });
    expect(await rolesOf(s.lab.id, s.engineer.id)).toEqual(['engineer', 'reviewer']);
    const [entry] = await t.sequelize.query<{ before: unknown; after: unknown }>("SELECT before, after FROM audit_log WHERE action = 'member-roles' AND entity_id = :id", { replacements: { id: s.engineer.id }, type: QueryTypes.SELECT });
    expect(entry).toEqual({ before: { roles: ['engineer'] }, after: { roles: ['engineer', 'reviewer'] } });

    const wrongKind = await admin('put', `/members/${s.engineer.id}/roles`, { roles: ['manufacturer-viewer'] });
    expect(wrongKind.status).toBe(422);
    expect(wrongKind.body.errors[0].pointer).toBe('/roles');
    expect(await rolesOf(s.lab.id, s.engineer.id)).toEqual(['engineer', 'reviewer']);
  });

  it('keeps manufacturer roles in manufacturer organizations', async () => {
    const s = await buildLabScenario(t.sequelize);
    const makerAdmin = await callerFor(t.app, s.makerAdmin, s.maker.id);
    expect((await makerAdmin('put', `/members/${s.makerViewer.id}/roles`, { roles: ['engineer'] })).status).toBe(422);
    const ok = await makerAdmin('put', `/members/${s.makerViewer.id}/roles`, { roles: ['manufacturer-admin'] });
    expect(ok.status).toBe(200);
    expect(await rolesOf(s.maker.id, s.makerViewer.id)).toEqual(['manufacturer-admin']);
  });

  it('never removes the last administrator, by role change or removal', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const demote = await admin('put', `/members/${s.admin.id}/roles`, { roles: ['engineer'] });
    expect(demote.status).toBe(409);
    expect(demote.body.code).toBe('last-admin');
    expect((await admin('delete', `/members/${s.admin.id}`)).status).toBe(409);
    expect(await rolesOf(s.lab.id, s.admin.id)).toEqual(['lab-admin']);
    // With a second administrator, the first may step down.
    await admin('put', `/members/${s.reviewer.id}/roles`, { roles: ['reviewer', 'lab-admin'] });
    expect((await admin('put', `/members/${s.admin.id}/roles`, { roles: ['engineer'] })).status).toBe(200);
  });

  it('two administrators demoting each other at once: one of them stays an administrator', async () => {
    const s = await buildLabScenario(t.sequelize);
    const second = await buildUser(t.sequelize, s.lab.id, ['lab-admin']);
    const a = await callerFor(t.app, s.admin, s.lab.id);
    const b = await callerFor(t.app, second, s.lab.id);
    const [ra, rb] = await Promise.all([a('put', `/members/${second.id}/roles`, { roles: ['engineer'] }), b('put', `/members/${s.admin.id}/roles`, { roles: ['engineer'] })]);
    // The loser is refused either by the last-administrator rule (409, both checked their roles
    // before either committed) or, when the winner committed first, because the loser is no
    // longer an administrator (403: roles are read from the database at the start of each request).
    const [won, lost] = [ra.status, rb.status].sort();
    expect(won).toBe(200);
    expect([403, 409]).toContain(lost);
    const [{ n }] = await t.sequelize.query<{ n: string }>("SELECT count(*) AS n FROM memberships WHERE organization_id = :org AND role = 'lab-admin'", { replacements: { org: s.lab.id }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(1);
  });

  it('removes a member, audited; their account stays', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    expect((await admin('delete', `/members/${s.billing.id}`)).status).toBe(204);
    expect(await rolesOf(s.lab.id, s.billing.id)).toEqual([]);
    const [{ n }] = await t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM users WHERE id = :id', { replacements: { id: s.billing.id }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(1);
    expect((await admin('delete', `/members/${s.billing.id}`)).status).toBe(404);
  });

  it('cannot reach the members of another organization (404), nor change them through its own', async () => {
    const a = await buildLabScenario(t.sequelize);
    const b = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, a.admin, a.lab.id);
    expect((await admin('put', `/members/${b.engineer.id}/roles`, { roles: ['reviewer'] })).status).toBe(404);
    expect((await admin('delete', `/members/${b.engineer.id}`)).status).toBe(404);
    // The lab's own client organization is another organization too.
    expect((await admin('delete', `/members/${a.makerViewer.id}`)).status).toBe(404);
    expect(await rolesOf(b.lab.id, b.engineer.id)).toEqual(['engineer']);
    expect(await rolesOf(a.maker.id, a.makerViewer.id)).toEqual(['manufacturer-viewer']);
    expect((await admin('delete', '/members/not-a-uuid')).status).toBe(404);
  });

  it.each([
    [{}],
    [{ roles: [] }],
    [{ roles: 'engineer' }],
    [{ roles: ['engineer', 'engineer'] }],
    [{ roles: ['owner'] }],
    [{ roles: ['engineer'], extra: true }],
    [{ roles: ['x'.repeat(10_000)] }],
  ])('refuses bad input %j with 422 and changes nothing', async (body) => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const res = await admin('put', `/members/${s.engineer.id}/roles`, body);
    expect(res.status).toBe(422);
    expect(await rolesOf(s.lab.id, s.engineer.id)).toEqual(['engineer']);
  });
});
