/** Refresh cookies carry Secure when the deployment says so (its own app: models bind per file). */
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { buildOrganization, buildUser, TEST_PASSWORD } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ secureCookies: true });
});
afterAll(() => t?.close());

test('the refresh cookie is HttpOnly, SameSite=Strict, scoped to /api/auth, and Secure when configured', async () => {
  const lab = await buildOrganization(t.sequelize);
  const user = await buildUser(t.sequelize, lab.id, ['engineer']);
  const secureApp = t.app;
  const res = await request(secureApp).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  const cookie = String(res.headers['set-cookie']);
  expect(cookie).toMatch(/HttpOnly/);
  expect(cookie).toMatch(/Secure/);
  expect(cookie).toMatch(/SameSite=Strict/);
  expect(cookie).toMatch(/Path=\/api\/auth/);
});

