/**
 * Review comments through the real API on the test database: who may write, what the thread
 * looks like, that nothing written can be changed, that every comment is audited, and that
 * another lab's run or a case of another plan answers like one that does not exist.
 */
import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { AuditEntry, RunComment } from '../db/models';
import { inTenant } from '../tenancy/tenant-transaction';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
}, 60_000);
afterAll(() => t?.close());

type Caller = (method: 'get' | 'post' | 'put', path: string, body?: object) => request.Test;

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  const as = async (user: { email: string }, org = s.lab.id): Promise<Caller> => {
    const { token } = await signIn(t.app, user.email);
    return (method, path, body) => {
      const r = request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', org);
      return body ? r.send(body) : r;
    };
  };
  const engineer = await as(s.engineer);
  const reviewer = await as(s.reviewer);
  const created = await engineer('post', '/runs', { planId: s.plan.id });
  expect(created.status).toBe(201);
  const run = created.body as { id: string; number: string; testCases: { id: string }[] };
  const thread = `/runs/${run.id}/cases/${run.testCases[0].id}/comments`;
  return { s, as, engineer, reviewer, run, thread };
}

describe('review comments', () => {
  it('keeps a thread per test case, oldest first, with each author’s name and role', async () => {
    const { s, engineer, reviewer, thread } = await setup();
    const asked = await reviewer('post', thread, { body: '  Which RBW was the carrier read with?  ' });
    expect(asked.status).toBe(201);
    // Surrounding spaces are not part of what was said.
    expect(asked.body.body).toBe('Which RBW was the carrier read with?');
    expect(asked.body.authorRole).toBe('reviewer');
    expect(asked.body.authorName).toBe(s.reviewer.displayName);
    const answered = await engineer('post', thread, { body: '10 Hz, as the method asks.' });
    expect(answered.status).toBe(201);
    expect(answered.body.authorRole).toBe('engineer');
    const list = await engineer('get', thread);
    expect(list.status).toBe(200);
    expect(list.body.items.map((c: { body: string }) => c.body)).toEqual(['Which RBW was the carrier read with?', '10 Hz, as the method asks.']);
  });

  it('refuses an empty or blank comment and one over 4000 characters, with a 422', async () => {
    const { reviewer, thread } = await setup();
    expect((await reviewer('post', thread, { body: '' })).status).toBe(422);
    expect((await reviewer('post', thread, { body: '   \n ' })).status).toBe(422);
    expect((await reviewer('post', thread, { body: 'x'.repeat(4001) })).status).toBe(422);
    expect((await reviewer('post', thread, { body: 'x'.repeat(4000) })).status).toBe(201);
  });

  it('lets neither billing nor the manufacturer read or write a thread', async () => {
    const { s, as, thread } = await setup();
    const billing = await as(s.billing);
    const maker = await as(s.makerAdmin, s.maker.id);
    expect((await billing('get', thread)).status).toBe(403);
    expect((await billing('post', thread, { body: 'hello' })).status).toBe(403);
    expect((await maker('get', thread)).status).toBe(403);
  });

  it('answers 404 for another lab’s run and for a case that is not in the run’s plan', async () => {
    const { thread, run } = await setup();
    const other = await setup();
    // Another lab's engineer, in their own organization, asking for our run.
    expect((await other.engineer('get', thread)).status).toBe(404);
    expect((await other.engineer('post', thread, { body: 'peek' })).status).toBe(404);
    const foreignCase = `/runs/${run.id}/cases/${other.run.testCases[0].id}/comments`;
    const mine = await setup();
    expect((await mine.engineer('get', `/runs/${mine.run.id}/cases/${other.run.testCases[0].id}/comments`)).status).toBe(404);
    expect(foreignCase).toContain(run.id);
  });

  it('is append-only in the database and audited', async () => {
    const { s, reviewer, run, thread } = await setup();
    const posted = await reviewer('post', thread, { body: 'Please attach the trace.' });
    await expect(
      inTenant(t.sequelize, s.lab.id, () => t.sequelize.query("UPDATE run_comments SET body = 'changed' WHERE id = :id", { replacements: { id: posted.body.id } })),
    ).rejects.toThrow(/immutable/);
    await expect(inTenant(t.sequelize, s.lab.id, () => t.sequelize.query('DELETE FROM run_comments WHERE id = :id', { replacements: { id: posted.body.id } }))).rejects.toThrow(/immutable/);
    const entry = await inTenant(t.sequelize, s.lab.id, () => AuditEntry.findOne({ where: { action: 'comment', entityId: run.id } }));
    expect(entry?.userId).toBe(s.reviewer.id);
    expect((entry?.after as { body: string }).body).toBe('Please attach the trace.');
  });

  it('is invisible outside the lab’s tenant scope (row-level security)', async () => {
    const { s, reviewer, thread } = await setup();
    await reviewer('post', thread, { body: 'Visible to this lab only.' });
    const other = await setup();
    const seen = await inTenant(t.sequelize, other.s.lab.id, () => RunComment.count({ where: { organizationId: s.lab.id } }));
    expect(seen).toBe(0);
  });

  it('closes the thread once the run is issued', async () => {
    const { s, engineer, reviewer, run, thread } = await setup();
    // 47 CFR 80.207(c): carrier at least 40 dB below PEP; 50 - 4.5 = 45.5 dB passes (arithmetic).
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 50, carrierDbm: 4.5 } });
    expect((await engineer('post', `/runs/${run.id}/submit`, {})).status).toBe(200);
    expect((await reviewer('post', thread, { body: 'Looks right.' })).status).toBe(201);
    expect((await reviewer('post', `/runs/${run.id}/approve`, {})).status).toBe(200);
    await inTenant(t.sequelize, s.lab.id, () => t.sequelize.query("UPDATE test_runs SET state = 'issued' WHERE id = :id", { replacements: { id: run.id } }));
    const closed = await reviewer('post', thread, { body: 'One more thing.' });
    expect(closed.status).toBe(409);
    expect(closed.body.code).toBe('comments-closed');
    // The thread itself stays readable.
    expect((await reviewer('get', thread)).body.items).toHaveLength(1);
  });
});
