import crypto from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildOrganization, buildUser, signIn, TEST_PASSWORD } from '../../test/support/factories';
import { recordingMail } from './recording-mail.test-support';

const mail = recordingMail();
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ mail });
});
afterAll(() => t?.close());

const ask = (email: unknown) => request(t.app).post('/api/auth/password-reset/request').send({ email });
const complete = (body: object) => request(t.app).post('/api/auth/password-reset/complete').send(body);
const resetsOf = (userId: string) =>
  t.sequelize.query<{ token_hash: string; expires_at: Date; created_at: Date; used_at: Date | null }>('SELECT * FROM password_resets WHERE user_id = :userId ORDER BY created_at', { replacements: { userId }, type: QueryTypes.SELECT });
const NEW_PASSWORD = 'a-brand-new-password-5';

describe('password reset', () => {
  it('mails a one-hour single-use link; completing it sets the password and ends every session', async () => {
    const user = await buildUser(t.sequelize, (await buildOrganization(t.sequelize)).id, ['engineer']);
    const session = await signIn(t.app, user.email);
    const res = await ask(user.email.toUpperCase());
    expect(res.status).toBe(202);
    const token = mail.tokenFrom(user.email, '/password-reset/');
    const [row] = await resetsOf(user.id);
    // SHA-256 (FIPS 180-4) from node:crypto; the token itself is not stored.
    expect(row.token_hash).toBe(crypto.createHash('sha256').update(token).digest('hex'));
    expect(new Date(row.expires_at).getTime() - new Date(row.created_at).getTime()).toBeCloseTo(3600_000, -3);

    const done = await complete({ token, password: NEW_PASSWORD });
    expect(done.status).toBe(204);
    // The refresh cookie from before the reset no longer works; the new password does, the old does not.
    expect((await request(t.app).post('/api/auth/refresh').set('Cookie', session.cookie)).status).toBe(401);
    // From a documentation address (RFC 5737), so this expected failure does not count against loopback.
    expect((await request(t.app).post('/api/auth/sign-in').set('X-Forwarded-For', '198.51.100.7').send({ email: user.email, password: TEST_PASSWORD })).status).toBe(401);
    expect((await signIn(t.app, user.email, NEW_PASSWORD)).token).toBeTruthy();

    const reused = await complete({ token, password: 'yet-another-password-6' });
    expect(reused.status).toBe(410);
    expect(reused.body.code).toBe('reset-used');
    expect((await signIn(t.app, user.email, NEW_PASSWORD)).token).toBeTruthy();
    const [{ n }] = await t.sequelize.query<{ n: string }>("SELECT count(*) AS n FROM audit_log WHERE action = 'password-reset' AND user_id = :id", { replacements: { id: user.id }, type: QueryTypes.SELECT });
    expect(Number(n)).toBe(1);
  });

  it('answers the same for an unknown address, and sends nothing', async () => {
    const before = mail.sent.length;
    const address = `nobody-${Date.now()}@test.example`;
    const res = await ask(address);
    expect(res.status).toBe(202);
    const known = await ask((await buildUser(t.sequelize, null, [])).email);
    expect(res.body).toEqual(known.body);
    expect(mail.sent.slice(before).map((m) => m.to)).not.toContain(address);
  });

  it('refuses an expired link with 410, and an older link once a newer one is used', async () => {
    const user = await buildUser(t.sequelize, null, []);
    await ask(user.email);
    const first = mail.tokenFrom(user.email, '/password-reset/');
    await ask(user.email);
    const second = mail.tokenFrom(user.email, '/password-reset/');
    expect(second).not.toBe(first);
    await t.sequelize.query("UPDATE password_resets SET expires_at = now() - interval '1 second' WHERE token_hash = :hash", {
      replacements: { hash: crypto.createHash('sha256').update(second).digest('hex') },
    });
    const expired = await complete({ token: second, password: NEW_PASSWORD });
    expect(expired.status).toBe(410);
    expect(expired.body.code).toBe('reset-expired');
    expect((await complete({ token: first, password: NEW_PASSWORD })).status).toBe(204);
    await ask(user.email);
    const third = mail.tokenFrom(user.email, '/password-reset/');
    expect((await complete({ token: third, password: 'third-password-123' })).status).toBe(204);
    // Using the third spent nothing it should not have: the first was already used.
    expect((await complete({ token: first, password: 'x-password-1234' })).status).toBe(410);
  });

  it('keeps the link when the new password is too weak, and 404s an unknown link', async () => {
    const user = await buildUser(t.sequelize, null, []);
    await ask(user.email);
    const token = mail.tokenFrom(user.email, '/password-reset/');
    const weak = await complete({ token, password: 'onlyletterslong' });
    expect(weak.status).toBe(422);
    expect(weak.body.errors[0].pointer).toBe('/password');
    expect((await resetsOf(user.id))[0].used_at).toBeNull();
    expect((await complete({ token: crypto.randomBytes(32).toString('base64url'), password: NEW_PASSWORD })).status).toBe(404);
    expect((await complete({ token, password: NEW_PASSWORD })).status).toBe(204);
  });

  it('sends at most five links an hour to one account', async () => {
    const user = await buildUser(t.sequelize, null, []);
    for (let i = 0; i < 7; i++) expect((await ask(user.email)).status).toBe(202);
    expect(mail.sent.filter((m) => m.to === user.email)).toHaveLength(5);
  });

  it.each([[{}], [{ email: 5 }], [{ email: 'no-at-sign' }], [{ email: 'a@test.example', extra: 1 }], [{ email: `${'a'.repeat(300)}@test.example` }]])(
    'request refuses %j with 422',
    async (body) => {
      expect((await request(t.app).post('/api/auth/password-reset/request').send(body)).status).toBe(422);
    },
  );

  it.each([[{}], [{ token: 'a'.repeat(43) }], [{ token: 'short', password: NEW_PASSWORD }], [{ token: 'a'.repeat(43), password: 'x'.repeat(201) }], [{ token: 'a'.repeat(43), password: NEW_PASSWORD, userId: 'x' }]])(
    'complete refuses %j with 422',
    async (body) => {
      expect((await complete(body)).status).toBe(422);
    },
  );
});
