/**
 * The role x route x organization matrix, walked over the router's own table: every route, every
 * role, own organization and another one. A route added without an entry here fails the suite.
 */
import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { routeTable } from '../route-table';
import { ROLES, type Role } from '../../shared/access/roles';

const LAB_ALL: Role[] = ['lab-admin', 'engineer', 'reviewer', 'billing'];
const EVERY_MEMBER: Role[] = [...ROLES];
type Expect = Role[] | 'public' | 'signed-in';

/** Who may call each route: written by hand from the product's rules, not read from the code. */
const EXPECTED: Record<string, Expect> = {
  'get /health': 'public',
  'post /auth/sign-in': 'public',
  'post /auth/refresh': 'public',
  'post /auth/sign-out': 'public',
  'post /auth/sign-out-everywhere': 'signed-in',
  'get /me': 'signed-in',
  'post /auth/sign-up': 'public',
  'post /auth/password-reset/request': 'public',
  'post /auth/password-reset/complete': 'public',
  'get /members': EVERY_MEMBER,
  'put /members/:userId/roles': ['lab-admin', 'manufacturer-admin'],
  'delete /members/:userId': ['lab-admin', 'manufacturer-admin'],
  'post /invitations': ['lab-admin', 'manufacturer-admin'],
  'get /invitations': ['lab-admin', 'manufacturer-admin'],
  'delete /invitations/:id': ['lab-admin', 'manufacturer-admin'],
  'get /invitations/lookup/:token': 'public',
  'post /invitations/accept': 'public',
  'post /clients/:id/invitations': ['lab-admin'],
  'post /api-keys': ['lab-admin'],
  'get /api-keys': ['lab-admin'],
  'delete /api-keys/:id': ['lab-admin'],
  'post /auditor-grants': ['lab-admin'],
  'get /auditor-grants': ['lab-admin'],
  'delete /auditor-grants/:id': ['lab-admin'],
  'get /auditor/reports': 'signed-in',
  'get /auditor/reports/:id/pdf': 'signed-in',
  'get /organization': EVERY_MEMBER,
  'put /organization': ['lab-admin', 'manufacturer-admin'],
  'get /organization/mail-settings': ['lab-admin'],
  'put /organization/mail-settings': ['lab-admin'],
  'get /clients': LAB_ALL,
  'get /clients/:id': LAB_ALL,
  'post /clients': ['lab-admin', 'engineer'],
  'put /clients/:id': ['lab-admin', 'engineer'],
  'get /devices': LAB_ALL,
  'get /devices/:id': LAB_ALL,
  'post /devices': ['lab-admin', 'engineer'],
  'put /devices/:id': ['lab-admin', 'engineer'],
  'get /rule-sets': LAB_ALL,
  'get /rule-sets/:id': LAB_ALL,
  'post /rule-sets/:id/copy': ['lab-admin', 'engineer'],
  'put /rule-sets/:id': ['lab-admin', 'engineer'],
  'get /instruments': LAB_ALL,
  'get /instruments/:id': LAB_ALL,
  'post /instruments': ['lab-admin', 'engineer'],
  'put /instruments/:id': ['lab-admin', 'engineer'],
  'put /runs/:id/instruments': ['lab-admin', 'engineer'],
  'get /home': LAB_ALL,
  'get /plans': LAB_ALL,
  'get /plans/:id': LAB_ALL,
  'post /plans': ['lab-admin', 'engineer'],
  'get /runs': LAB_ALL,
  'post /runs': ['lab-admin', 'engineer'],
  'get /runs/:id': LAB_ALL,
  'put /runs/:id/cases/:caseId/reading': ['lab-admin', 'engineer'],
  'post /runs/:id/cases/:caseId/uploads': ['lab-admin', 'engineer'],
  'get /runs/:id/uploads': LAB_ALL,
  'get /uploads/:id': LAB_ALL,
  'get /uploads/:id/file': LAB_ALL,
  'get /precheck/rule-sets': ['manufacturer-admin', 'manufacturer-viewer'],
  'post /precheck': ['manufacturer-admin', 'manufacturer-viewer'],
  'post /runs/:id/submit': ['lab-admin', 'engineer'],
  'post /runs/:id/return': ['lab-admin', 'reviewer'],
  'post /runs/:id/approve': ['lab-admin', 'reviewer'],
  'get /runs/:id/cases/:caseId/comments': ['lab-admin', 'engineer', 'reviewer'],
  'post /runs/:id/cases/:caseId/comments': ['lab-admin', 'engineer', 'reviewer'],
  'post /runs/:id/issue': ['lab-admin', 'reviewer'],
  'post /reports/:id/withdraw': ['lab-admin', 'reviewer'],
  'post /runs/:id/revise': ['lab-admin', 'reviewer'],
  'get /reports': EVERY_MEMBER,
  'get /reports/:id': EVERY_MEMBER,
  'get /reports/:id/pdf': EVERY_MEMBER,
  'get /reports/:id/certificate': EVERY_MEMBER,
  'get /verify/:token': 'public',
  'get /billing/price-list': ['lab-admin', 'billing'],
  'put /billing/price-list': ['lab-admin', 'billing'],
  'post /billing/adjustments': ['lab-admin', 'billing'],
  'get /billing/sales': ['lab-admin', 'billing'],
  'get /billing/offers': ['manufacturer-admin', 'manufacturer-viewer'],
  'get /billing/balance': ['manufacturer-admin', 'manufacturer-viewer'],
  'post /billing/checkout': ['manufacturer-admin'],
  'post /billing/webhook': 'public',
  'get /billing/purchases': ['lab-admin', 'billing', 'manufacturer-admin', 'manufacturer-viewer'],
  'get /billing/purchases/:id': ['lab-admin', 'billing', 'manufacturer-admin', 'manufacturer-viewer'],
  'get /billing/purchases/:id/receipt': ['lab-admin', 'billing', 'manufacturer-admin', 'manufacturer-viewer'],
  'get /billing/ledger': ['lab-admin', 'billing', 'manufacturer-admin', 'manufacturer-viewer'],
  'get /openapi.json': 'public',
};

let t: TestApp;
let s: Awaited<ReturnType<typeof buildLabScenario>>;
let other: Awaited<ReturnType<typeof buildLabScenario>>;
const tokens = new Map<Role, { token: string; org: string }>();
let labApiKey: string;
/** Routes a lab's bench-automation key may call (saving readings, uploading files): by hand, from the product's rules. */
const API_KEY_ROUTES = new Set(['put /runs/:id/cases/:caseId/reading', 'post /runs/:id/cases/:caseId/uploads']);

beforeAll(async () => {
  t = await startTestApp();
  s = await buildLabScenario(t.sequelize);
  other = await buildLabScenario(t.sequelize);
  const people: [Role, { email: string }, string][] = [
    ['lab-admin', s.admin, s.lab.id],
    ['engineer', s.engineer, s.lab.id],
    ['reviewer', s.reviewer, s.lab.id],
    ['billing', s.billing, s.lab.id],
    ['manufacturer-admin', s.makerAdmin, s.maker.id],
    ['manufacturer-viewer', s.makerViewer, s.maker.id],
  ];
  for (const [role, person, org] of people) tokens.set(role, { token: (await signIn(t.app, person.email)).token, org });
  const key = await request(t.app).post('/api/api-keys').set('Authorization', `Bearer ${tokens.get('lab-admin')!.token}`).set('X-Organization-Id', s.lab.id).send({ name: 'Matrix bench' });
  labApiKey = key.body.key;
}, 60_000);
afterAll(() => t?.close());

const routes = () =>
  routeTable({ sequelize: {} as never, tokens: { secret: 'x', accessTtlSeconds: 1, refreshTtlSeconds: 1 }, secureCookies: false, reports: {} as never, mail: {} as never, publicUrl: '', billing: {} as never }).map((r) => `${r.method} ${r.path}`);

function fill(path: string): string {
  return path.replace(':caseId', s.cases[0].id).replace(':token', 'no-such-token-000').replace(':id', s.device.id);
}

function call(key: string, auth?: { token: string; org: string }) {
  const [method, path] = key.split(' ');
  let r = (request(t.app) as unknown as Record<string, (u: string) => request.Test>)[method](`/api${fill(path)}`);
  if (auth) r = r.set('Authorization', `Bearer ${auth.token}`).set('X-Organization-Id', auth.org);
  return method === 'get' ? r : r.send({});
}

test('every route in the router table has an expected access rule, and every rule a route', () => {
  const keys = routes();
  expect(keys.filter((k) => !(k in EXPECTED))).toEqual([]);
  expect(Object.keys(EXPECTED).filter((k) => !keys.includes(k))).toEqual([]);
});

describe.each(Object.entries(EXPECTED))('%s', (key, expected) => {
  if (expected === 'public') {
    test('answers without sign-in (any refusal is about the request, not a missing sign-in)', async () => {
      const res = await call(key);
      expect(res.status).not.toBe(403);
      expect(res.body?.detail).not.toBe('Sign in to continue.');
    });
    return;
  }
  test('refuses an anonymous caller with 401', async () => {
    expect((await call(key)).status).toBe(401);
  });
  test.each([...ROLES])('role %s', async (role) => {
    const res = await call(key, tokens.get(role)!);
    const allowed = expected === 'signed-in' || expected.includes(role);
    if (allowed) expect([401, 403]).not.toContain(res.status);
    else expect(res.status).toBe(403);
  });
  if (expected !== 'signed-in') {
    test('another organization named as active answers 404', async () => {
      const me = tokens.get(expected[0])!;
      const res = await call(key, { token: me.token, org: other.lab.id });
      expect(res.status).toBe(404);
    });
  }
  test(API_KEY_ROUTES.has(key) ? 'admits the lab’s API key' : 'refuses an API key (401/403)', async () => {
    const [method, path] = key.split(' ');
    const r = (request(t.app) as unknown as Record<string, (u: string) => request.Test>)[method](`/api${fill(path)}`).set('Authorization', `ApiKey ${labApiKey}`);
    const res = method === 'get' ? await r : await r.send({});
    if (API_KEY_ROUTES.has(key)) expect([401, 403]).not.toContain(res.status);
    else expect([401, 403]).toContain(res.status);
  });
});
