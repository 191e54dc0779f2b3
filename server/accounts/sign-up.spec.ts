import request from 'supertest';
import jwt from 'jsonwebtoken';
import { QueryTypes } from 'sequelize';
import { startTestApp, TEST_JWT_SECRET, type TestApp } from '../../test/support/test-app';
import { buildUser } from '../../test/support/factories';
import { proposeOrganizationCode } from './organization-code';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

let n = 0;
const fresh = () => `signup-${Date.now().toString(36)}-${++n}@test.example`;
const body = (overrides: Record<string, unknown> = {}) => ({
  labName: 'Harbour Radio Test Laboratory',
  address: ['1 Quay Road', 'Portsmouth'],
  name: 'Ada Admin',
  email: fresh(),
  password: 'a-long-password-77',
  ...overrides,
});
const countWhere = async (sql: string, replacements: Record<string, unknown>) =>
  Number((await t.sequelize.query<{ n: string }>(sql, { replacements, type: QueryTypes.SELECT }))[0].n);
const usersWith = (email: string) => countWhere('SELECT count(*) AS n FROM users WHERE lower(email) = lower(:email)', { email });

describe('POST /api/auth/sign-up', () => {
  it('creates the lab, the person and a lab-admin membership, audits it and signs them in', async () => {
    const labCode = 'hr' + String(Date.now() % 100000);
    const b = body({ labCode });
    const res = await request(t.app).post('/api/auth/sign-up').send(b);
    expect(res.status).toBe(201);
    // Answers like sign-in: an access token carrying the membership, and the refresh cookie.
    const claims = jwt.verify(res.body.accessToken, TEST_JWT_SECRET) as { sub: string; orgs: { organizationId: string; kind: string; roles: string[] }[] };
    expect(claims.orgs).toEqual([expect.objectContaining({ organizationId: res.body.organizationId, kind: 'lab', roles: ['lab-admin'] })]);
    expect(String(res.headers['set-cookie'])).toMatch(/sidecheck_refresh=.+HttpOnly/);
    const [org] = await t.sequelize.query<{ kind: string; name: string; code: string; address_lines: string[] }>('SELECT * FROM organizations WHERE id = :id', { replacements: { id: res.body.organizationId }, type: QueryTypes.SELECT });
    expect(org).toMatchObject({ kind: 'lab', name: b.labName, code: labCode.toUpperCase(), address_lines: b.address });
    const [user] = await t.sequelize.query<{ password_hash: string }>('SELECT password_hash FROM users WHERE id = :id', { replacements: { id: claims.sub }, type: QueryTypes.SELECT });
    // Argon2id PHC string (RFC 9106 / the PHC string format), never the password itself.
    expect(user.password_hash).toMatch(/^\$argon2id\$v=19\$/);
    expect(await countWhere("SELECT count(*) AS n FROM audit_log WHERE action = 'sign-up' AND entity_id = :id", { id: res.body.organizationId })).toBe(1);
    // The new admin can use the lab at once.
    const members = await request(t.app).get('/api/members').set('Authorization', `Bearer ${res.body.accessToken}`);
    expect(members.status).toBe(200);
    expect(members.body.items).toEqual([expect.objectContaining({ email: b.email, roles: ['lab-admin'] })]);
  });

  it('makes a lab code from the name when none is chosen', async () => {
    const res = await request(t.app).post('/api/auth/sign-up').send(body({ labName: 'Quay Side Radio Lab' }));
    expect(res.status).toBe(201);
    const [org] = await t.sequelize.query<{ code: string }>('SELECT code FROM organizations WHERE id = :id', { replacements: { id: res.body.organizationId }, type: QueryTypes.SELECT });
    // The schema's CHECK (0001): 2-8 upper-case letters or digits; initials first, then a number.
    expect(org.code).toMatch(/^QSRL(\d{3})?$/);
  });

  it('refuses an e-mail address that has an account with 409, without saying more', async () => {
    const existing = await buildUser(t.sequelize, null, []);
    const res = await request(t.app).post('/api/auth/sign-up').send(body({ email: existing.email.toUpperCase() }));
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('email-taken');
    expect(res.body.detail).toMatch(/already exists/);
    expect(JSON.stringify(res.body)).not.toContain(existing.displayName);
    expect(await usersWith(existing.email)).toBe(1);
  });

  it('refuses a lab code in use with 409 and stores nothing', async () => {
    const code = 'D' + String(Date.now() % 1000000);
    expect((await request(t.app).post('/api/auth/sign-up').send(body({ labCode: code }))).status).toBe(201);
    const again = body({ labCode: code });
    const res = await request(t.app).post('/api/auth/sign-up').send(again);
    expect(res.status).toBe(409);
    expect(res.body.code).toBe('lab-code-taken');
    expect(await usersWith(again.email)).toBe(0);
  });

  it('refuses a weak password with 422 naming the field', async () => {
    const b = body({ password: 'short1' });
    const res = await request(t.app).post('/api/auth/sign-up').send(b);
    expect(res.status).toBe(422);
    expect(res.body.errors).toEqual([{ pointer: '/password', message: 'Use at least 12 characters.' }]);
    expect(await usersWith(b.email)).toBe(0);
  });

  it.each([
    ['a missing field', { labName: undefined }],
    ['a wrong type', { address: 'one line' }],
    ['an unknown field', { plan: 'enterprise' }],
    ['a huge name', { name: 'x'.repeat(5000) }],
    ['a blank lab name', { labName: '   ' }],
    ['a bad lab code', { labCode: 'A-1' }],
    ['too many address lines', { address: Array.from({ length: 7 }, (_, i) => `line ${i}`) }],
    ['a malformed e-mail', { email: 'not-an-address' }],
    ['a number as password', { password: 123456789012 }],
  ])('refuses %s with 4xx and stores nothing', async (_what, overrides) => {
    const b = body(overrides);
    const res = await request(t.app).post('/api/auth/sign-up').send(JSON.parse(JSON.stringify(b)));
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    if (typeof b.email === 'string') expect(await usersWith(b.email)).toBe(0);
  });
});

describe('proposeOrganizationCode', () => {
  it.each([
    ['Harbour RF Test Lab', 'HRTL'],
    ['Acme', 'ACME'],
    ['Électronique Côtière', 'EC'],
    ['!!!', 'ORG'],
    ['A Very Long Name For A Laboratory', 'AVLNF'],
  ])('%s -> %s (initials, at most 5, so a 3-digit suffix still fits 8)', (name, code) => {
    expect(proposeOrganizationCode(name)).toBe(code);
  });
});
