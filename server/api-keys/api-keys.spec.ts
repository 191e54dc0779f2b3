import crypto from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { asSystem } from '../tenancy/tenant-transaction';
import { callerFor } from '../accounts/api-caller.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const system = <T extends object>(sql: string, replacements: Record<string, unknown>) =>
  asSystem(t.sequelize, (transaction) => t.sequelize.query<T>(sql, { replacements, type: QueryTypes.SELECT, transaction }));

/** A lab with a run on the bench and a fresh API key. */
async function benchWithKey() {
  const s = await buildLabScenario(t.sequelize);
  const admin = await callerFor(t.app, s.admin, s.lab.id);
  const engineer = await callerFor(t.app, s.engineer, s.lab.id);
  const run = (await engineer('post', '/runs', { planId: s.plan.id })).body as { id: string; testCases: { id: string }[] };
  const created = await admin('post', '/api-keys', { name: 'Bench 3 automation' });
  expect(created.status).toBe(201);
  const readingPath = `/api/runs/${run.id}/cases/${run.testCases[0].id}/reading`;
  return { s, admin, engineer, run, readingPath, key: created.body.key as string, keyId: created.body.id as string, created: created.body };
}
// 47 CFR 80.207(c): J3E carrier at least 40 dB below PEP; 50 dBm PEP and 4.5 dBm carrier give 45.5 dB (arithmetic).
const READING = { values: { pepDbm: 50, carrierDbm: 4.5 } };

describe('API keys for bench automation', () => {
  it('shows the key once, and stores only its SHA-256 and a short prefix', async () => {
    const { admin, key, keyId, created } = await benchWithKey();
    expect(key).toMatch(/^sck_[A-Za-z0-9_-]{43}$/);
    // 32 random bytes in base64url without padding (RFC 4648 section 5): 43 characters.
    expect(Buffer.from(key.slice(4), 'base64url')).toHaveLength(32);
    expect(created).toMatchObject({ name: 'Bench 3 automation', prefix: key.slice(0, 12), lastUsedAt: null, revokedAt: null });
    const [row] = await system<Record<string, unknown>>('SELECT * FROM api_keys WHERE id = :id', { id: keyId });
    expect(row.key_hash).toBe(crypto.createHash('sha256').update(key).digest('hex'));
    expect(JSON.stringify(row)).not.toContain(key.slice(12));
    const list = await admin('get', '/api-keys');
    expect(list.status).toBe(200);
    expect(list.body.items).toEqual([expect.objectContaining({ id: keyId, prefix: key.slice(0, 12), name: 'Bench 3 automation', lastUsedAt: null, revokedAt: null })]);
    expect(JSON.stringify(list.body)).not.toContain(key.slice(12));
    expect(JSON.stringify(list.body)).not.toContain(String(row.key_hash));
  });

  it('saves a reading with the key: entered by nobody, the key named in the audit log, last use recorded', async () => {
    const { s, run, readingPath, key, keyId } = await benchWithKey();
    const res = await request(t.app).put(readingPath).set('Authorization', `ApiKey ${key}`).send(READING);
    expect(res.status).toBe(200);
    expect(res.body.result.value).toBeCloseTo(45.5, 10);
    const readings = await system<{ entered_by: string | null }>('SELECT entered_by FROM readings WHERE run_id = :id', { id: run.id });
    expect(readings).toEqual([{ entered_by: null }]);
    const entries = await t.sequelize.query<{ user_id: string | null; api_key_id: string | null; organization_id: string }>(
      "SELECT user_id, api_key_id, organization_id FROM audit_log WHERE action = 'save-reading' AND entity_id = :id",
      { replacements: { id: run.id }, type: QueryTypes.SELECT },
    );
    expect(entries).toEqual([{ user_id: null, api_key_id: keyId, organization_id: s.lab.id }]);
    // The X-Api-Key header works the same.
    expect((await request(t.app).put(readingPath).set('X-Api-Key', key).send(READING)).status).toBe(200);
    const [used] = await system<{ last_used_at: Date | null }>('SELECT last_used_at FROM api_keys WHERE id = :id', { id: keyId });
    expect(used.last_used_at).not.toBeNull();
  });

  it('writes lastUsedAt at most once a minute', async () => {
    const { readingPath, key, keyId } = await benchWithKey();
    const lastUsed = async () => (await system<{ last_used_at: Date }>('SELECT last_used_at FROM api_keys WHERE id = :id', { id: keyId }))[0].last_used_at;
    await request(t.app).put(readingPath).set('X-Api-Key', key).send(READING);
    const first = await lastUsed();
    await request(t.app).put(readingPath).set('X-Api-Key', key).send(READING);
    expect(await lastUsed()).toEqual(first);
    await asSystem(t.sequelize, (transaction) => t.sequelize.query("UPDATE api_keys SET last_used_at = now() - interval '61 seconds' WHERE id = :id", { replacements: { id: keyId }, transaction }));
    const aged = await lastUsed();
    await request(t.app).put(readingPath).set('X-Api-Key', key).send(READING);
    expect((await lastUsed()).getTime()).toBeGreaterThan(aged.getTime() + 60_000);
  });

  it('is refused on every other route with a clear 403', async () => {
    const { run, key } = await benchWithKey();
    for (const [method, path] of [['get', `/api/runs/${run.id}`], ['get', '/api/api-keys'], ['post', `/api/runs/${run.id}/submit`], ['get', '/api/me']] as const) {
      const res = await request(t.app)[method](path).set('Authorization', `ApiKey ${key}`);
      expect([401, 403]).toContain(res.status);
    }
    const res = await request(t.app).get(`/api/runs/${run.id}`).set('X-Api-Key', key);
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/API key can only save readings/);
  });

  it('refuses a revoked, an unknown or a malformed key with 401, and a key sent with a sign-in token with 400', async () => {
    const { admin, run, readingPath, key, keyId } = await benchWithKey();
    expect((await admin('delete', `/api-keys/${keyId}`)).status).toBe(204);
    expect((await admin('delete', `/api-keys/${keyId}`)).status).toBe(204);
    expect((await admin('get', '/api-keys')).body.items[0].revokedAt).not.toBeNull();
    const unknown = `sck_${crypto.randomBytes(32).toString('base64url')}`;
    for (const bad of [key, unknown, 'sck_short', 'x'.repeat(5000)]) {
      const res = await request(t.app).put(readingPath).set('X-Api-Key', bad).send(READING);
      expect(res.status).toBe(401);
      expect(res.body.detail).toMatch(/not valid or has been revoked/);
    }
    const fresh = (await admin('post', '/api-keys', { name: 'Second' })).body.key;
    const both = await request(t.app).put(readingPath).set('Authorization', 'Bearer some.jwt.token').set('X-Api-Key', fresh).send(READING);
    expect(both.status).toBe(400);
    const readings = await system<{ n: string }>('SELECT count(*) AS n FROM readings WHERE run_id = :id', { id: run.id });
    expect(Number(readings[0].n)).toBe(0);
  });

  it('a lab’s key cannot touch another lab’s runs, and keys stay within their lab', async () => {
    const a = await benchWithKey();
    const b = await benchWithKey();
    const res = await request(t.app).put(b.readingPath).set('X-Api-Key', a.key).send(READING);
    expect(res.status).toBe(404);
    expect(Number((await system<{ n: string }>('SELECT count(*) AS n FROM readings WHERE run_id = :id', { id: b.run.id }))[0].n)).toBe(0);
    // Naming the other lab as active organization does not change the key's organization.
    const named = await request(t.app).put(b.readingPath).set('X-Api-Key', a.key).set('X-Organization-Id', b.s.lab.id).send(READING);
    expect(named.status).toBe(404);
    expect((await b.admin('get', '/api-keys')).body.items.map((k: { id: string }) => k.id)).toEqual([b.keyId]);
    expect((await b.admin('delete', `/api-keys/${a.keyId}`)).status).toBe(404);
    expect((await a.admin('get', '/api-keys')).body.items[0].revokedAt).toBeNull();
  });

  it.each([[{}], [{ name: '' }], [{ name: '   ' }], [{ name: 42 }], [{ name: 'x'.repeat(101) }], [{ name: 'ok', organizationId: 'x' }]])(
    'refuses %j with 422 and stores nothing',
    async (body) => {
      const s = await buildLabScenario(t.sequelize);
      const admin = await callerFor(t.app, s.admin, s.lab.id);
      expect((await admin('post', '/api-keys', body)).status).toBe(422);
      expect(Number((await system<{ n: string }>('SELECT count(*) AS n FROM api_keys WHERE organization_id = :org', { org: s.lab.id }))[0].n)).toBe(0);
    },
  );
});
