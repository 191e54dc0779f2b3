import crypto from 'node:crypto';
import request from 'supertest';
import jwt from 'jsonwebtoken';
import { QueryTypes } from 'sequelize';
import { startTestApp, TEST_JWT_SECRET, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn, TEST_PASSWORD } from '../../test/support/factories';
import { Client } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { callerFor } from './api-caller.test-support';
import { recordingMail } from './recording-mail.test-support';

const mail = recordingMail();
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ mail });
});
afterAll(() => t?.close());

let n = 0;
const newAddress = () => `invitee-${Date.now().toString(36)}-${++n}@test.example`;
/** Invitations are behind row-level security: read them in the system scope. */
const invitationRows = (email: string) =>
  asSystem(t.sequelize, (transaction) =>
    t.sequelize.query<{ id: string; token_hash: string; expires_at: Date; created_at: Date; accepted_at: Date | null; revoked_at: Date | null; organization_id: string }>(
      'SELECT * FROM invitations WHERE lower(email) = lower(:email) ORDER BY created_at',
      { replacements: { email }, type: QueryTypes.SELECT, transaction },
    ),
  );
const sql = (text: string, replacements: Record<string, unknown>) => asSystem(t.sequelize, (transaction) => t.sequelize.query(text, { replacements, transaction }));
const lookup = (token: string) => request(t.app).get(`/api/invitations/lookup/${token}`);
const accept = (body: object) => request(t.app).post('/api/invitations/accept').send(body);

describe('inviting a new person into a lab', () => {
  it('e-mails a single-use link that expires in 7 days, stored only as its hash', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const email = newAddress();
    const res = await admin('post', '/invitations', { email, role: 'engineer' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email, role: 'engineer', status: 'pending', organizationId: s.lab.id });
    expect(JSON.stringify(res.body)).not.toMatch(/token/i);
    const message = mail.lastTo(email);
    expect(message.text).toContain('http://127.0.0.1:4610/invitations/');
    expect(message.html).toContain('http://127.0.0.1:4610/invitations/');
    const token = mail.tokenFrom(email, '/invitations/');
    const [row] = await invitationRows(email);
    // SHA-256 (FIPS 180-4) of the token from node:crypto, and never the token itself.
    expect(row.token_hash).toBe(crypto.createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBeCloseTo(7 * 86_400_000, -4);

    const pending = await admin('get', '/invitations');
    expect(pending.body.items.map((i: { email: string }) => i.email)).toContain(email);

    const info = await lookup(token);
    expect(info.status).toBe(200);
    expect(info.body).toMatchObject({ kind: 'member', organizationName: s.lab.name, organizationKind: 'lab', role: 'engineer', email, accountExists: false });

    const accepted = await accept({ token, name: 'New Engineer', password: 'a-long-password-88' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.accountCreated).toBe(true);
    const claims = jwt.verify(accepted.body.accessToken, TEST_JWT_SECRET) as { orgs: { organizationId: string; roles: string[] }[] };
    expect(claims.orgs).toEqual([expect.objectContaining({ organizationId: s.lab.id, roles: ['engineer'] })]);
    expect(String(accepted.headers['set-cookie'])).toMatch(/sidecheck_refresh=/);
    expect((await signIn(t.app, email, 'a-long-password-88')).token).toBeTruthy();

    // Single use: the same link again, and its lookup, are refused as gone.
    const again = await accept({ token, name: 'Someone Else', password: 'another-password-99' });
    expect(again.status).toBe(410);
    expect(again.body.code).toBe('invitation-used');
    expect((await lookup(token)).status).toBe(410);
    expect((await admin('get', '/invitations')).body.items.map((i: { email: string }) => i.email)).not.toContain(email);
  });

  it('adds an existing account without touching its password, and reports that it exists', async () => {
    const s = await buildLabScenario(t.sequelize);
    const other = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    await admin('post', '/invitations', { email: other.engineer.email.toUpperCase(), role: 'reviewer' });
    const token = mail.tokenFrom(other.engineer.email, '/invitations/');
    expect((await lookup(token)).body.accountExists).toBe(true);
    const res = await accept({ token, password: 'attacker-chosen-password-1' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ accountCreated: false, kind: 'member', organizationId: s.lab.id });
    const signedIn = await request(t.app).post('/api/auth/sign-in').send({ email: other.engineer.email, password: TEST_PASSWORD });
    const orgs = (jwt.decode(signedIn.body.accessToken) as { orgs: { organizationId: string; roles: string[] }[] }).orgs;
    expect(orgs).toEqual(expect.arrayContaining([expect.objectContaining({ organizationId: s.lab.id, roles: ['reviewer'] }), expect.objectContaining({ organizationId: other.lab.id, roles: ['engineer'] })]));
  });

  it('refuses an expired link (410) and a revoked one (410); an unknown one is 404', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const late = newAddress();
    await admin('post', '/invitations', { email: late, role: 'billing' });
    const lateToken = mail.tokenFrom(late, '/invitations/');
    await sql("UPDATE invitations SET expires_at = now() - interval '1 second' WHERE lower(email) = lower(:email)", { email: late });
    expect((await lookup(lateToken)).body.code).toBe('invitation-expired');
    const expired = await accept({ token: lateToken, name: 'Late', password: 'a-long-password-88' });
    expect(expired.status).toBe(410);
    expect(expired.body.detail).toMatch(/expired/);

    const revokedAddress = newAddress();
    const created = await admin('post', '/invitations', { email: revokedAddress, role: 'billing' });
    const revokedToken = mail.tokenFrom(revokedAddress, '/invitations/');
    expect((await admin('delete', `/invitations/${created.body.id}`)).status).toBe(204);
    expect((await admin('delete', `/invitations/${created.body.id}`)).status).toBe(204);
    const revoked = await accept({ token: revokedToken, name: 'Revoked', password: 'a-long-password-88' });
    expect(revoked.status).toBe(410);
    expect(revoked.body.code).toBe('invitation-revoked');

    for (const address of [late, revokedAddress]) {
      const [{ n: users }] = await t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM users WHERE lower(email) = lower(:address)', { replacements: { address }, type: QueryTypes.SELECT });
      expect(Number(users)).toBe(0);
    }
    const unknown = crypto.randomBytes(32).toString('base64url');
    expect((await lookup(unknown)).status).toBe(404);
    expect((await accept({ token: unknown, name: 'X', password: 'a-long-password-88' })).status).toBe(404);
    expect((await lookup('short')).status).toBe(404);
  });

  it('a second invitation to the same address replaces the first link', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const email = newAddress();
    await admin('post', '/invitations', { email, role: 'engineer' });
    const first = mail.tokenFrom(email, '/invitations/');
    await admin('post', '/invitations', { email, role: 'reviewer' });
    const second = mail.tokenFrom(email, '/invitations/');
    expect((await lookup(first)).body.code).toBe('invitation-revoked');
    expect((await lookup(second)).body.role).toBe('reviewer');
  });

  it('two acceptances of one link at once: exactly one succeeds', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const email = newAddress();
    await admin('post', '/invitations', { email, role: 'engineer' });
    const token = mail.tokenFrom(email, '/invitations/');
    const results = await Promise.all([accept({ token, name: 'One', password: 'a-long-password-88' }), accept({ token, name: 'Two', password: 'a-long-password-88' })]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 410]);
  });

  it('asks for a name and password only when the account must be created, and keeps the link usable', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const email = newAddress();
    await admin('post', '/invitations', { email, role: 'engineer' });
    const token = mail.tokenFrom(email, '/invitations/');
    const missing = await accept({ token });
    expect(missing.status).toBe(422);
    expect(missing.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(['/name', '/password']);
    const weak = await accept({ token, name: 'Weak', password: 'password' });
    expect(weak.status).toBe(422);
    expect((await accept({ token, name: 'Strong', password: 'a-long-password-88' })).status).toBe(200);
  });

  it('refuses roles of the other kind of organization, and people already in it', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const email = newAddress();
    const wrong = await admin('post', '/invitations', { email, role: 'manufacturer-viewer' });
    expect(wrong.status).toBe(422);
    expect(await invitationRows(email)).toEqual([]);
    const member = await admin('post', '/invitations', { email: s.engineer.email, role: 'reviewer' });
    expect(member.status).toBe(409);
    expect(member.body.code).toBe('already-member');
    // A manufacturer administrator invites manufacturer roles only.
    const maker = await callerFor(t.app, s.makerAdmin, s.maker.id);
    expect((await maker('post', '/invitations', { email, role: 'engineer' })).status).toBe(422);
    expect((await maker('post', '/invitations', { email, role: 'manufacturer-viewer' })).status).toBe(201);
  });

  it('keeps each organization’s invitations to itself', async () => {
    const a = await buildLabScenario(t.sequelize);
    const b = await buildLabScenario(t.sequelize);
    const adminA = await callerFor(t.app, a.admin, a.lab.id);
    const adminB = await callerFor(t.app, b.admin, b.lab.id);
    const email = newAddress();
    const created = await adminA('post', '/invitations', { email, role: 'engineer' });
    expect((await adminB('get', '/invitations?pageSize=200')).body.items.map((i: { id: string }) => i.id)).not.toContain(created.body.id);
    expect((await adminB('delete', `/invitations/${created.body.id}`)).status).toBe(404);
    expect((await invitationRows(email))[0].revoked_at).toBeNull();
  });

  it.each([
    [{}],
    [{ email: 'x@test.example' }],
    [{ email: 'not an address', role: 'engineer' }],
    [{ email: 5, role: 'engineer' }],
    [{ email: 'x@test.example', role: 'owner' }],
    [{ email: 'x@test.example', role: 'engineer', admin: true }],
    [{ email: `${'x'.repeat(300)}@test.example`, role: 'engineer' }],
  ])('POST /invitations refuses %j with 422 and stores nothing', async (body) => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const res = await admin('post', '/invitations', body);
    expect(res.status).toBe(422);
    const [{ n: count }] = await asSystem(t.sequelize, (transaction) =>
      t.sequelize.query<{ n: string }>('SELECT count(*) AS n FROM invitations WHERE organization_id = :org', { replacements: { org: s.lab.id }, type: QueryTypes.SELECT, transaction }),
    );
    expect(Number(count)).toBe(0);
  });

  it.each([
    [{}],
    [{ token: 'short' }],
    [{ token: 5 }],
    [{ token: 'a'.repeat(43), name: 'x'.repeat(201), password: 'a-long-password-88' }],
    [{ token: 'a'.repeat(43), name: 'N', password: 'a-long-password-88', role: 'lab-admin' }],
  ])('POST /invitations/accept refuses %j with 422', async (body) => {
    expect((await accept(body)).status).toBe(422);
  });
});

describe('inviting the first administrator of a manufacturer client', () => {
  async function clientWithoutOrganization(labId: string) {
    const contactEmail = newAddress();
    const client = await asSystem(t.sequelize, (transaction) =>
      Client.create({ organizationId: labId, name: `Coastal Radios ${n}`, addressLines: ['3 Dock Lane'], contactName: 'Cora Contact', contactEmail }, { transaction }),
    );
    return { client, contactEmail };
  }

  it('creates the client’s organization, links it, and invites its manufacturer-admin', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const { client, contactEmail } = await clientWithoutOrganization(s.lab.id);
    const res = await admin('post', `/clients/${client.id}/invitations`, {});
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: contactEmail, role: 'manufacturer-admin', sponsorOrganizationId: s.lab.id });
    const linked = await admin('get', `/clients/${client.id}`);
    const makerId = linked.body.clientOrganizationId;
    expect(makerId).toBe(res.body.organizationId);
    const [org] = await t.sequelize.query<{ kind: string; name: string }>('SELECT kind, name FROM organizations WHERE id = :id', { replacements: { id: makerId }, type: QueryTypes.SELECT });
    expect(org).toEqual({ kind: 'manufacturer', name: client.name });
    // The lab sees the invitation it sent into its client's organization.
    expect((await admin('get', '/invitations')).body.items).toContainEqual(expect.objectContaining({ id: res.body.id, organizationName: client.name }));

    const token = mail.tokenFrom(contactEmail, '/invitations/');
    const accepted = await accept({ token, name: 'Cora Contact', password: 'a-long-password-88' });
    expect(accepted.status).toBe(200);
    const claims = jwt.decode(accepted.body.accessToken) as { orgs: { organizationId: string; kind: string; roles: string[] }[] };
    expect(claims.orgs).toEqual([expect.objectContaining({ organizationId: makerId, kind: 'manufacturer', roles: ['manufacturer-admin'] })]);
    const reports = await request(t.app).get('/api/reports').set('Authorization', `Bearer ${accepted.body.accessToken}`);
    expect(reports.status).toBe(200);

    // Once the client has its own administrator, the lab cannot add people to it.
    const again = await admin('post', `/clients/${client.id}/invitations`, { email: newAddress() });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe('client-has-members');
  });

  it('invites into an existing, still empty, client organization at the address given', async () => {
    const s = await buildLabScenario(t.sequelize);
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const { client } = await clientWithoutOrganization(s.lab.id);
    await admin('post', `/clients/${client.id}/invitations`, {});
    const makerId = (await admin('get', `/clients/${client.id}`)).body.clientOrganizationId;
    const email = newAddress();
    const res = await admin('post', `/clients/${client.id}/invitations`, { email });
    expect(res.status).toBe(201);
    expect(res.body.organizationId).toBe(makerId);
    expect(mail.lastTo(email).subject).toContain(client.name);
  });

  it('refuses another lab’s client (404), non-admins (403) and bad input (422), storing nothing', async () => {
    const a = await buildLabScenario(t.sequelize);
    const b = await buildLabScenario(t.sequelize);
    const { client } = await clientWithoutOrganization(b.lab.id);
    const adminA = await callerFor(t.app, a.admin, a.lab.id);
    expect((await adminA('post', `/clients/${client.id}/invitations`, {})).status).toBe(404);
    const engineerB = await callerFor(t.app, b.engineer, b.lab.id);
    expect((await engineerB('post', `/clients/${client.id}/invitations`, {})).status).toBe(403);
    const adminB = await callerFor(t.app, b.admin, b.lab.id);
    for (const body of [{ email: 'nope' }, { email: 'x@test.example', role: 'lab-admin' }, { email: 7 }]) {
      expect((await adminB('post', `/clients/${client.id}/invitations`, body)).status).toBe(422);
    }
    expect((await adminB('get', `/clients/${client.id}`)).body.clientOrganizationId).toBeNull();
  });
});

describe('with the real mail queue', () => {
  it('the invitation e-mail is a pg-boss job, committed with the invitation', async () => {
    const real = await startTestApp();
    try {
      const s = await buildLabScenario(real.sequelize);
      const admin = await callerFor(real.app, s.admin, s.lab.id);
      const email = newAddress();
      expect((await admin('post', '/invitations', { email, role: 'engineer' })).status).toBe(201);
      // A refused invitation (already a member) enqueues nothing.
      expect((await admin('post', '/invitations', { email: s.engineer.email, role: 'reviewer' })).status).toBe(409);
      const jobs = await real.sequelize.query<{ data: { to: string; text: string } }>(
        "SELECT data FROM pgboss.job WHERE name = 'mail' AND data->>'to' IN (:to)",
        { replacements: { to: [email, s.engineer.email] }, type: QueryTypes.SELECT },
      );
      expect(jobs.map((j) => j.data.to)).toEqual([email]);
      expect(jobs[0].data.text).toMatch(/http:\/\/127\.0\.0\.1:4610\/invitations\/[A-Za-z0-9_-]{43}/);
    } finally {
      await real.close();
    }
  });
});
