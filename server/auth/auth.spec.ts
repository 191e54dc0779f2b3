import request from 'supertest';
import jwt from 'jsonwebtoken';
import { QueryTypes } from 'sequelize';
import { asSystem } from '../tenancy/tenant-transaction';
import { startTestApp, TEST_JWT_SECRET, type TestApp } from '../../test/support/test-app';
import { buildOrganization, buildUser, signIn, TEST_PASSWORD } from '../../test/support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const refreshWith = (cookie: string) => request(t.app).post('/api/auth/refresh').set('Cookie', cookie);
const cookieOf = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]).join('; ');

describe('sign-in', () => {
  it('gives an access token carrying the memberships, and an httpOnly SameSite refresh cookie', async () => {
    const lab = await buildOrganization(t.sequelize);
    const user = await buildUser(t.sequelize, lab.id, ['engineer']);
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: user.email.toUpperCase(), password: TEST_PASSWORD });
    expect(res.status).toBe(200);
    const claims = jwt.verify(res.body.accessToken, TEST_JWT_SECRET) as { sub: string; orgs: { organizationId: string; roles: string[] }[] };
    expect(claims.sub).toBe(user.id);
    expect(claims.orgs).toEqual([expect.objectContaining({ organizationId: lab.id, roles: ['engineer'] })]);
    const setCookie = String(res.headers['set-cookie']);
    expect(setCookie).toMatch(/HttpOnly/);
    expect(setCookie).toMatch(/SameSite=Strict/);
    expect(setCookie).toMatch(/Path=\/api\/auth/);
    // The audit entry is written in the same transaction as the refresh token (auth/routes.ts), before its COMMIT.
    const audit = await asSystem(t.sequelize, (transaction) =>
      t.sequelize.query<{ action: string; entity_id: string; after: { email: string } }>("SELECT action, entity_id, after FROM audit_log WHERE user_id = :id AND action LIKE 'sign-in%'", { replacements: { id: user.id }, type: QueryTypes.SELECT, transaction }),
    );
    expect(audit).toEqual([{ action: 'sign-in', entity_id: user.id, after: { email: user.email.toUpperCase() } }]);
    expect((await refreshWith(cookieOf(res))).status).toBe(200);
  });

  it('answers a wrong password and an unknown account the same way, as problem+json', async () => {
    const user = await buildUser(t.sequelize, null, []);
    const wrong = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'not-the-password-1' });
    const unknown = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody@test.example', password: 'not-the-password-1' });
    for (const res of [wrong, unknown]) {
      expect(res.status).toBe(401);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(res.body.detail).toBe('The e-mail address or password is not right.');
    }
  });

  it('refuses a malformed body with the fields named', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 5, extra: true });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toEqual(expect.arrayContaining(['/email', '/password', '/extra']));
  });
});

describe('tokens', () => {
  it('refuses tampered, expired and wrong-algorithm tokens', async () => {
    const lab = await buildOrganization(t.sequelize);
    const user = await buildUser(t.sequelize, lab.id, ['engineer']);
    const { token } = await signIn(t.app, user.email);
    const ok = await request(t.app).get('/api/me').set('Authorization', `Bearer ${token}`);
    expect(ok.status).toBe(200);
    const [h, p, s] = token.split('.');
    const tampered = `${h}.${Buffer.from(JSON.stringify({ ...JSON.parse(Buffer.from(p, 'base64url').toString()), sub: '00000000-0000-0000-0000-000000000000' })).toString('base64url')}.${s}`;
    const expired = jwt.sign({ orgs: [] }, TEST_JWT_SECRET, { subject: user.id, expiresIn: -10, issuer: 'sidecheck', audience: 'sidecheck-api' });
    const none = `${Buffer.from('{"alg":"none","typ":"JWT"}').toString('base64url')}.${p}.`;
    const hs512 = jwt.sign({ orgs: [] }, TEST_JWT_SECRET, { algorithm: 'HS512', subject: user.id, issuer: 'sidecheck', audience: 'sidecheck-api' });
    for (const bad of [tampered, expired, none, hs512]) {
      const res = await request(t.app).get('/api/me').set('Authorization', `Bearer ${bad}`);
      expect(res.status).toBe(401);
    }
  });

  it('rotates the refresh token, and reuse of a rotated one revokes the whole family', async () => {
    const user = await buildUser(t.sequelize, (await buildOrganization(t.sequelize)).id, ['reviewer']);
    const first = await signIn(t.app, user.email);
    const r1 = await refreshWith(first.cookie);
    expect(r1.status).toBe(200);
    const second = cookieOf(r1);
    expect(second).not.toBe(first.cookie);
    // The first cookie is replayed (as a thief would): refused, and the family is closed.
    const replay = await refreshWith(first.cookie);
    expect(replay.status).toBe(401);
    expect(replay.body.detail).toMatch(/used twice/);
    const afterRevocation = await refreshWith(second);
    expect(afterRevocation.status).toBe(401);
  });

  it('signs out everywhere', async () => {
    const user = await buildUser(t.sequelize, (await buildOrganization(t.sequelize)).id, ['engineer']);
    const a = await signIn(t.app, user.email);
    const b = await signIn(t.app, user.email);
    const out = await request(t.app).post('/api/auth/sign-out-everywhere').set('Authorization', `Bearer ${a.token}`);
    expect(out.status).toBe(200);
    expect(out.body.revokedSessions).toBe(2);
    expect((await refreshWith(a.cookie)).status).toBe(401);
    expect((await refreshWith(b.cookie)).status).toBe(401);
  });
});
