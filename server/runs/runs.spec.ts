import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser, signIn } from '../../test/support/factories';
import { Reading, Result } from '../db/models';
import { inTenant } from '../tenancy/tenant-transaction';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  const as = async (user: { email: string }) => {
    const { token } = await signIn(t.app, user.email);
    return (method: 'get' | 'post' | 'put', path: string, body?: object) => {
      const r = request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
      return body ? r.send(body) : r;
    };
  };
  const engineer = await as(s.engineer);
  const reviewer = await as(s.reviewer);
  const created = await engineer('post', '/runs', { planId: s.plan.id });
  expect(created.status).toBe(201);
  return { s, engineer, reviewer, run: created.body as { id: string; number: string; state: string; testCases: { id: string }[] } };
}

describe('readings and results', () => {
  it('stores the reading unchanged and the server-computed result with the engine version', async () => {
    const { engineer, run } = await setup();
    // 47 CFR 80.207(c): J3E carrier at least 40 dB below PEP. PEP 50.0 dBm, carrier 4.5 dBm -> 45.5 dB (arithmetic).
    const res = await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4.5 } });
    expect(res.status).toBe(200);
    expect(res.body.result.value).toBeCloseTo(45.5, 10);
    expect(res.body.result.limit).toBe(40);
    expect(res.body.result.verdict).toBe('pass');
    expect(res.body.result.engineVersion).toMatch(/^\d+\.\d+\.\d+$/);
    const detail = await engineer('get', `/runs/${run.id}`);
    expect(detail.body.testCases[0].reading.values).toEqual({ pepDbm: 50, carrierDbm: 4.5 });
  });

  it('keeps an incomplete reading and says why it was not evaluated', async () => {
    const { engineer, run } = await setup();
    const res = await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: null } });
    expect(res.status).toBe(200);
    expect(res.body.result).toBeNull();
    expect(res.body.problem).toMatch(/Carrier level is required/);
  });

  it('never edits history: a new reading is a new row, and the database refuses changes to old ones', async () => {
    const { s, engineer, run } = await setup();
    const path = `/runs/${run.id}/cases/${run.testCases[0].id}/reading`;
    await engineer('put', path, { values: { pepDbm: 50, carrierDbm: 20 } });
    await engineer('put', path, { values: { pepDbm: 50, carrierDbm: 5 } });
    const counts = await inTenant(t.sequelize, s.lab.id, async () => [await Reading.count({ where: { runId: run.id } }), await Result.count({ where: { runId: run.id } })]);
    expect(counts).toEqual([2, 2]);
    await expect(inTenant(t.sequelize, s.lab.id, () => t.sequelize.query('UPDATE readings SET values = \'{}\' WHERE run_id = :id', { replacements: { id: run.id } }))).rejects.toThrow(/immutable/);
  });

  it('shows the latest reading of each case and only its own result, however many readings came before', async () => {
    const { engineer, run } = await setup();
    const path = `/runs/${run.id}/cases/${run.testCases[0].id}/reading`;
    let last = await engineer('put', path, { values: { pepDbm: 50, carrierDbm: 20 } });
    for (let carrier = 19; carrier >= 5; carrier--) last = await engineer('put', path, { values: { pepDbm: 50, carrierDbm: carrier } });
    // 47 CFR 80.207(c): 40 dB below PEP. PEP 50 dBm, carrier 5 dBm -> 45 dB, a pass (arithmetic).
    const detail = (await engineer('get', `/runs/${run.id}`)).body;
    const shown = detail.testCases[0];
    expect(shown.reading).toEqual({ ...last.body.reading, enteredBy: expect.any(String) });
    expect(shown.result).toEqual(last.body.result);
    expect(shown.result).toMatchObject({ value: 45, verdict: 'pass', readingId: last.body.reading.id });
    expect(detail.testCases.slice(1).every((c: { reading: unknown; result: unknown }) => c.reading === null && c.result === null)).toBe(true);
    // A newer reading that does not evaluate hides the older result instead of showing it beside the wrong values.
    const incomplete = await engineer('put', path, { values: { pepDbm: 50, carrierDbm: null } });
    const after = (await engineer('get', `/runs/${run.id}`)).body.testCases[0];
    expect(after.reading.id).toBe(incomplete.body.reading.id);
    expect(after.result).toBeNull();
  });

  it.each([
    [{ values: { pepDbm: 'fifty' } }, 422],
    [{ values: { pepDbm: 1e300 } }, 422],
    [{ values: { 'bad key': 1 } }, 422],
    [{ values: {}, extra: 1 }, 422],
    [{}, 422],
  ])('refuses bad input %j with %i and stores nothing', async (body, status) => {
    const { s, engineer, run } = await setup();
    const res = await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, body);
    expect(res.status).toBe(status);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    expect(await inTenant(t.sequelize, s.lab.id, () => Reading.count({ where: { runId: run.id } }))).toBe(0);
  });
});

describe('the run state machine', () => {
  it('walks testing -> in-review -> approved, with the four-eyes rule and reasons for returns', async () => {
    const { s, engineer, reviewer, run } = await setup();
    // Submitting without results is refused.
    expect((await engineer('post', `/runs/${run.id}/submit`)).body.code).toBe('results-missing');
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    expect((await engineer('post', `/runs/${run.id}/submit`)).body.state).toBe('in-review');
    // Illegal: approving twice, submitting again, readings while in review.
    expect((await engineer('post', `/runs/${run.id}/submit`)).status).toBe(409);
    expect((await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 1, carrierDbm: 1 } })).status).toBe(409);
    // Returning needs a reason.
    expect((await reviewer('post', `/runs/${run.id}/return`, {})).status).toBe(422);
    const returned = await reviewer('post', `/runs/${run.id}/return`, { reason: 'Carrier read with 1 kHz RBW; repeat at 10 Hz.' });
    expect(returned.body.state).toBe('testing');
    expect(returned.body.returnReason).toMatch(/10 Hz/);
    await engineer('post', `/runs/${run.id}/submit`);
    const approved = await reviewer('post', `/runs/${run.id}/approve`);
    expect(approved.status).toBe(200);
    expect(approved.body.state).toBe('approved');
    expect(approved.body.reviewerId).toBe(s.reviewer.id);
  });

  it('refuses approval by someone who took readings on the run, even a lab admin', async () => {
    const { s, run } = await setup();
    const adminEngineer = await buildUser(t.sequelize, s.lab.id, ['lab-admin']);
    const { token } = await signIn(t.app, adminEngineer.email);
    const as = (method: 'post' | 'put', path: string, body?: object) => request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send(body ?? {});
    await as('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    await as('post', `/runs/${run.id}/submit`);
    const res = await as('post', `/runs/${run.id}/approve`);
    expect(res.status).toBe(403);
    expect(res.body.detail).toMatch(/different reviewer/);
  });

  it('writes every state change to the append-only audit log', async () => {
    const { s, engineer, run } = await setup();
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4 } });
    await engineer('post', `/runs/${run.id}/submit`);
    const [rows] = await t.sequelize.query('SELECT action, user_id FROM audit_log WHERE entity_id = :id ORDER BY id', { replacements: { id: run.id } });
    expect((rows as { action: string }[]).map((r) => r.action)).toEqual(['create', 'save-reading', 'run-submit']);
    expect((rows as { user_id: string }[]).every((r) => r.user_id === s.engineer.id)).toBe(true);
    await expect(t.sequelize.query('DELETE FROM audit_log WHERE entity_id = :id', { replacements: { id: run.id } })).rejects.toThrow(/immutable/);
  });
});
