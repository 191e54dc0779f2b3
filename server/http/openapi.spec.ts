import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { routeTable } from '../route-table';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

test('GET /api/openapi.json describes every route with its body schema (OpenAPI 3.1)', async () => {
  const res = await request(t.app).get('/api/openapi.json');
  expect(res.status).toBe(200);
  expect(res.body.openapi).toBe('3.1.0');
  const routes = routeTable({ sequelize: {} as never, tokens: { secret: 'x', accessTtlSeconds: 1, refreshTtlSeconds: 1 }, secureCookies: false, reports: {} as never } as never);
  for (const r of routes) {
    const op = res.body.paths['/api' + r.path.replace(/:([A-Za-z]+)/g, '{$1}')]?.[r.method];
    expect(op).toBeDefined();
    if (r.bodySchema) expect(op.requestBody.content['application/json'].schema).toEqual(JSON.parse(JSON.stringify(r.bodySchema)));
    expect(op.security.length === 0).toBe(r.access.kind === 'public');
  }
});
