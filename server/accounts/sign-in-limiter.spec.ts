import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildUser, TEST_PASSWORD } from '../../test/support/factories';

let t: TestApp;
let second: TestApp;
beforeAll(async () => {
  t = await startTestApp();
  // A second app with its own connection pool stands for a second API process.
  second = await startTestApp();
});
afterAll(async () => {
  await t?.close();
  await second?.close();
});

// Client addresses from the documentation ranges (RFC 5737), one per test, so no test (nor any
// other suite signing in from 127.0.0.1) shares a count. The app trusts X-Forwarded-For from loopback.
let octet = Math.floor(Math.random() * 200);
const newAddress = () => `203.0.113.${(octet++ % 254) + 1}`;
const signInFrom = (app: TestApp, address: string, email: string, password: string) =>
  request(app.app).post('/api/auth/sign-in').set('X-Forwarded-For', address).send({ email, password });
const ageFailures = (key: string, minutes: number) =>
  t.sequelize.query(`UPDATE sign_in_failures SET failed_at = failed_at - make_interval(mins => :minutes) WHERE key = :key`, { replacements: { key, minutes } });

describe('sign-in rate limiting', () => {
  it('locks an account after 10 failures in 15 minutes, even for the right password, with Retry-After', async () => {
    const user = await buildUser(t.sequelize, null, []);
    for (let i = 0; i < 10; i++) expect((await signInFrom(t, newAddress(), user.email, 'wrong-password-1')).status).toBe(401);
    const locked = await signInFrom(t, newAddress(), user.email, TEST_PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.headers['content-type']).toMatch(/problem\+json/);
    expect(locked.body.detail).toMatch(/Too many failed sign-ins for this account\. Try again in 15 minutes/);
    const retryAfter = Number(locked.headers['retry-after']);
    expect(retryAfter).toBeGreaterThan(880);
    expect(retryAfter).toBeLessThanOrEqual(900);
  });

  it('opens again as failures age out of the window (sliding), and a success clears the account', async () => {
    const user = await buildUser(t.sequelize, null, []);
    const address = newAddress();
    for (let i = 0; i < 10; i++) await signInFrom(t, address, user.email, 'wrong-password-1');
    await ageFailures(`account:${user.email.toLowerCase()}`, 10);
    const locked = await signInFrom(t, address, user.email, TEST_PASSWORD);
    expect(locked.status).toBe(429);
    // 15 min window - 10 min elapsed = about 300 s left.
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(280);
    expect(Number(locked.headers['retry-after'])).toBeLessThanOrEqual(300);
    await ageFailures(`account:${user.email.toLowerCase()}`, 6);
    expect((await signInFrom(t, address, user.email, TEST_PASSWORD)).status).toBe(200);
    // The success forgot the account's failures: nine more do not lock it.
    for (let i = 0; i < 9; i++) await signInFrom(t, address, user.email, 'wrong-password-1');
    expect((await signInFrom(t, address, user.email, TEST_PASSWORD)).status).toBe(200);
  });

  it('treats an address that has no account the same (nothing is revealed)', async () => {
    const email = `nobody-${Date.now()}@test.example`;
    for (let i = 0; i < 10; i++) expect((await signInFrom(t, newAddress(), email, 'wrong-password-1')).status).toBe(401);
    expect((await signInFrom(t, newAddress(), email, 'wrong-password-1')).status).toBe(429);
  });

  it('locks a client address after 50 failures, whichever accounts they were on; other addresses are not affected', async () => {
    const address = newAddress();
    for (let i = 0; i < 50; i++) expect((await signInFrom(t, address, `guess-${i}-${Date.now()}@test.example`, 'wrong-password-1')).status).toBe(401);
    const user = await buildUser(t.sequelize, null, []);
    const locked = await signInFrom(t, address, user.email, TEST_PASSWORD);
    expect(locked.status).toBe(429);
    expect(locked.body.detail).toMatch(/from your network/);
    expect((await signInFrom(t, newAddress(), user.email, TEST_PASSWORD)).status).toBe(200);
  }, 30_000);

  it('is shared by every API process: failures on one count on the other', async () => {
    const user = await buildUser(t.sequelize, null, []);
    for (let i = 0; i < 5; i++) await signInFrom(t, newAddress(), user.email, 'wrong-password-1');
    for (let i = 0; i < 5; i++) await signInFrom(second, newAddress(), user.email, 'wrong-password-1');
    expect((await signInFrom(t, newAddress(), user.email, TEST_PASSWORD)).status).toBe(429);
    expect((await signInFrom(second, newAddress(), user.email, TEST_PASSWORD)).status).toBe(429);
  });
});
