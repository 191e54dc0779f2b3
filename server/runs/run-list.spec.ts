/**
 * GET /api/runs: filters, sorts, search and pages give the same rows whichever way the query
 * takes them (the page from test_runs alone for sorts on the run, the joined list for sorts on
 * the device or client), and another lab's runs never appear.
 */
import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { Client, Device, TestPlan } from '../db/models';
import { QueryTypes } from 'sequelize';
import { asSystem, inTenant } from '../tenancy/tenant-transaction';
import { listRuns } from './run-list';
import type { ListQuery } from '../http/list-query';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

interface Row { id: string; number: string; state: string; client: string; model: string }

async function lab() {
  const s = await buildLabScenario(t.sequelize);
  // A second client with its own radio and plan, so sorting and searching by client and model mean something.
  const other = await asSystem(t.sequelize, async (transaction) => {
    const client = await Client.create({ organizationId: s.lab.id, name: 'Aardvark Marine Radio', addressLines: ['1 Quay'], contactName: 'A. Contact', contactEmail: 'contact@aardvark.example' }, { transaction });
    const device = await Device.create({ organizationId: s.lab.id, clientId: client.id, manufacturer: client.name, model: 'ZX-9 list test radio', serialNumber: 'SN-LIST-1', firmware: '1.0', ratedPepW: 100, emissionDesignator: '2K70J3E', frequencyMinHz: 1.6e6, frequencyMaxHz: 27.5e6, modes: ['USB'], receivedOn: '2026-11-01', condition: 'Good' }, { transaction });
    const plan = await TestPlan.create({ organizationId: s.lab.id, deviceId: device.id, ruleSetId: s.plan.ruleSetId, ruleSetSnapshot: s.plan.ruleSetSnapshot, name: 'ZX-9 plan' }, { transaction });
    return { client, plan };
  });
  const { token } = await signIn(t.app, s.engineer.email);
  const get = (query: string) => request(t.app).get(`/api/runs${query}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id);
  const ids: string[] = [];
  // Six runs: three of each plan, the last one made first in time; two sent on to review.
  for (const planId of [s.plan.id, other.plan.id, s.plan.id, other.plan.id, s.plan.id, other.plan.id]) {
    const res = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send({ planId });
    expect(res.status).toBe(201);
    ids.push(res.body.id);
  }
  await asSystem(t.sequelize, (transaction) =>
    t.sequelize.query(
      `UPDATE test_runs SET updated_at = '2026-11-01T00:00:00Z'::timestamptz + (array_position(ARRAY[:ids]::uuid[], id) * interval '1 hour'),
              state = CASE WHEN array_position(ARRAY[:ids]::uuid[], id) IN (2, 5) THEN 'in-review' ELSE state END
        WHERE id IN (:ids)`,
      { replacements: { ids }, transaction },
    ),
  );
  return { s, get, ids, otherClient: other.client.name };
}

describe('GET /api/runs', () => {
  it('pages newest first with the total, filters by state and keeps other labs out', async () => {
    const { get, ids } = await lab();
    await lab(); // a neighbour lab with runs of its own
    const first = await get('?pageSize=4');
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(6);
    expect(first.body.items.map((r: Row) => r.id)).toEqual([ids[5], ids[4], ids[3], ids[2]]);
    const second = await get('?pageSize=4&page=2');
    expect(second.body.items.map((r: Row) => r.id)).toEqual([ids[1], ids[0]]);
    expect(second.body.total).toBe(6);
    const review = await get('?state=in-review&sort=updatedAt');
    expect(review.body.items.map((r: Row) => r.id)).toEqual([ids[1], ids[4]]);
    expect(review.body.total).toBe(2);
    expect(review.body.items[0]).toEqual(expect.objectContaining({ state: 'in-review', planName: 'ZX-9 plan', model: 'ZX-9 list test radio', client: 'Aardvark Marine Radio' }));
    // Times as Date#toISOString writes them (UTC, milliseconds, Z), though PostgreSQL keeps microseconds.
    expect(review.body.items[0].updatedAt).toBe('2026-11-01T02:00:00.000Z');
    for (const item of first.body.items as { createdAt: string }[]) expect(new Date(item.createdAt).toISOString()).toBe(item.createdAt);
  });

  it('searches run numbers, models, serial numbers and client names', async () => {
    const { get, ids, otherClient } = await lab();
    const byClient = await get(`?search=${encodeURIComponent('aardvark')}`);
    expect(byClient.body.total).toBe(3);
    expect(byClient.body.items.every((r: Row) => r.client === otherClient)).toBe(true);
    const byModel = await get('?search=ZX-9&state=in-review');
    expect(byModel.body.items.map((r: Row) => r.id)).toEqual([ids[1]]);
    const bySerial = await get('?search=SN-LIST');
    expect(bySerial.body.total).toBe(3);
    const number = (await get('?pageSize=1')).body.items[0].number as string;
    const byNumber = await get(`?search=${number}`);
    expect(byNumber.body.items.map((r: Row) => r.number)).toEqual([number]);
    const wildcard = await get('?search=%25');
    expect(wildcard.body.total).toBe(0); // % is a character to find, not a wildcard
  });

  it('matches the beginning of words, every word of the search, words split at spaces and hyphens', async () => {
    const { get, otherClient } = await lab();
    // "SN-LIST-1" is found by its hyphen-separated parts too.
    expect((await get('?search=list')).body.total).toBe(3);
    expect((await get('?search=SN-LIST-1')).body.total).toBe(3);
    // Every word must match: the client is "Aardvark Marine Radio".
    const both = await get(`?search=${encodeURIComponent('marine aardv')}`);
    expect(both.body.total).toBe(3);
    expect(both.body.items.every((r: Row) => r.client === otherClient)).toBe(true);
    expect((await get(`?search=${encodeURIComponent('aardvark nothing-like-this')}`)).body.total).toBe(0);
    // A piece from the middle of a word is not a word's beginning.
    expect((await get('?search=ardvark')).body.total).toBe(0);
    expect((await get(`?search=${encodeURIComponent('a b c d e f g h i')}`)).status).toBe(400);
    // A page past the end of a search still carries its total.
    expect((await get('?search=list&page=5&pageSize=2')).body).toMatchObject({ items: [], total: 3 });
    expect((await get('?search=list&state=in-review&page=5&pageSize=2')).body).toMatchObject({ items: [], total: 1 });
  });

  it('sorts by client and by model, ties broken by id in the same direction', async () => {
    const { get, ids } = await lab();
    const byClient = await get('?sort=client&pageSize=3');
    expect(byClient.body.total).toBe(6);
    // "Aardvark Marine Radio" sorts before the scenario's "Test maker ..." client: runs 2, 4 and 6, by id.
    expect(byClient.body.items.map((r: Row) => r.id)).toEqual([ids[1], ids[3], ids[5]].sort());
    const byModelDown = await get('?sort=-model&pageSize=6');
    expect(byModelDown.body.items.slice(0, 3).map((r: Row) => r.id)).toEqual([ids[1], ids[3], ids[5]].sort().reverse());
  });

  it('follows a renamed client and a changed device: sort and search keys on the run are rewritten', async () => {
    const { s: scenario, get, ids } = await lab();
    await asSystem(t.sequelize, async (transaction) => {
      await Client.update({ name: 'Zebrafish Coastal' }, { where: { organizationId: scenario.lab.id, name: 'Aardvark Marine Radio' }, transaction });
      await Device.update({ manufacturer: 'QQ Radio Works', model: 'QQ-4 renamed radio', serialNumber: 'SN-RENAMED-7' }, { where: { organizationId: scenario.lab.id, model: 'ZX-9 list test radio' }, transaction });
    });
    expect((await get('?search=aardvark')).body.total).toBe(0);
    const renamed = await get('?search=zebrafish');
    expect(renamed.body.total).toBe(3);
    expect(renamed.body.items.every((r: Row) => r.client === 'Zebrafish Coastal' && r.model === 'QQ-4 renamed radio')).toBe(true);
    expect((await get('?search=sn-renamed')).body.total).toBe(3);
    // "Zebrafish" now sorts after the scenario's client: the other three runs come first.
    const byClient = await get('?sort=client&pageSize=6');
    expect(byClient.body.items.slice(3).map((r: Row) => r.id)).toEqual([ids[1], ids[3], ids[5]].sort());
  });

  it('keeps the per-state totals exact through new runs, moves between states and pages past the end', async () => {
    const { s: scenario, get } = await lab();
    const counts = () =>
      asSystem(t.sequelize, (transaction) =>
        t.sequelize.query<{ state: string; kept: string; counted: string }>(
          `SELECT s.state, coalesce(k.n, 0) AS kept, count(r.id) AS counted
             FROM unnest(ARRAY['draft','testing','in-review','approved','issued','withdrawn','superseded']) s(state)
             LEFT JOIN run_state_counts k ON k.organization_id = :org AND k.state = s.state
             LEFT JOIN test_runs r ON r.organization_id = :org AND r.state = s.state
            GROUP BY s.state, k.n`,
          { replacements: { org: scenario.lab.id }, type: QueryTypes.SELECT, transaction },
        ),
      );
    for (const row of await counts()) expect(row.kept).toBe(row.counted);
    expect((await get('')).body.total).toBe(6);
    expect((await get('?state=testing,in-review')).body.total).toBe(6);
    expect((await get('?state=in-review')).body.total).toBe(2);
    // A page past the end is empty and still says how many there are.
    const past = await get('?page=9&pageSize=4');
    expect(past.body).toMatchObject({ items: [], total: 6, page: 9 });
    // The engineer filter counts the matching runs themselves.
    expect((await get(`?engineerId=${scenario.engineer.id}&state=testing`)).body.total).toBe(4);
  });

  it('pages a search with hundreds of matches in the order of the list, with the total', async () => {
    const { s: scenario, get } = await lab();
    // 320 more runs (more than the 300 above which the list checks runs against the matches instead of reading them by id).
    await asSystem(t.sequelize, (transaction) =>
      t.sequelize.query(
        `INSERT INTO test_runs (organization_id, plan_id, number, state, engineer_id, created_at, updated_at)
         SELECT :org, :plan, 'BULK-' || lpad(g::text, 5, '0'), 'testing', :engineer, '2026-10-01'::timestamptz, '2026-10-01'::timestamptz + g * interval '1 minute'
           FROM generate_series(1, 320) g`,
        { replacements: { org: scenario.lab.id, plan: scenario.plan.id, engineer: scenario.engineer.id }, transaction },
      ),
    );
    const newest = await get('?search=bulk&pageSize=10');
    expect(newest.body.total).toBe(320);
    expect(newest.body.items.map((r: Row) => r.number)).toEqual(Array.from({ length: 10 }, (_, k) => `BULK-${String(320 - k).padStart(5, '0')}`));
    const third = await get('?search=bulk&sort=number&page=3&pageSize=100');
    expect(third.body.items.map((r: Row) => r.number)).toEqual(Array.from({ length: 100 }, (_, k) => `BULK-${String(201 + k).padStart(5, '0')}`));
    expect((await get('?search=bulk-0031')).body.total).toBe(10); // BULK-00310 ... BULK-00319
    expect((await get('?search=bulk&state=testing')).body.total).toBe(320);
    expect((await get('')).body.total).toBe(326);
  });

  it('plans a list without a search, of at most one state and a page size the screens offer, once per connection; others for their values', async () => {
    const { s: scenario } = await lab();
    interface Session { query(q: { text: string; values?: unknown[] }): Promise<{ rows: Record<string, unknown>[] }> }
    // Each list in a tenant transaction of its own, as a request makes it; the session (pooled connection) it ran on is kept.
    const listed = async (q: Partial<ListQuery>) => {
      let session: Session | undefined;
      const answer = await inTenant(t.sequelize, scenario.lab.id, (transaction) => {
        session = (transaction as unknown as { connection: Session }).connection;
        return listRuns(transaction, scenario.lab.id, { page: 1, pageSize: 25, sort: 'updatedAt', direction: 'DESC', filter: {}, ...q });
      });
      return { answer, session: session! };
    };
    // PostgreSQL's view of the session's named statements (pg_prepared_statements, PostgreSQL 14+): how
    // often each was run on a generic plan and how often planned for its values.
    const prepared = async (session: Session, fragment: string) =>
      (await session.query({ text: 'SELECT statement, generic_plans::int AS generic, custom_plans::int AS custom FROM pg_prepared_statements WHERE statement LIKE $1', values: [`%${fragment}%`] })).rows;
    const first = await listed({ filter: { state: 'in-review' }, sort: 'client', direction: 'ASC', page: 1 });
    expect(first.answer.total).toBe(2);
    const second = await listed({ filter: { state: 'in-review' }, sort: 'client', direction: 'ASC', page: 2, pageSize: 25 });
    expect(second.answer).toMatchObject({ items: [], total: 2, page: 2 });
    // One text for both pages (the state and page size written in, the offset a parameter), on its generic plan from the first run.
    const runs = second.session === first.session ? 2 : 1;
    expect(await prepared(first.session, "r.state = 'in-review' ORDER BY r.client_name ASC")).toEqual([expect.objectContaining({ generic: runs, custom: 0 })]);
    // The generic plan was asked for in the list's transaction only: the session is back to PostgreSQL's default.
    expect((await first.session.query({ text: 'SHOW plan_cache_mode' })).rows[0].plan_cache_mode).toBe('auto');
    // A search, two states or another page size: no named statement (planned for their values each time).
    const search = await listed({ filter: { search: 'ZX-9' } });
    expect(search.answer.total).toBe(3);
    expect(await prepared(search.session, 'run_search_terms')).toEqual([]);
    const two = await listed({ filter: { state: 'testing,in-review' }, sort: 'number', direction: 'ASC' });
    expect(two.answer.total).toBe(6);
    expect(await prepared(two.session, 'state = ANY(')).toEqual([]);
    const odd = await listed({ pageSize: 7, sort: 'createdAt', direction: 'ASC' });
    expect(odd.answer.items).toHaveLength(6);
    expect(await prepared(odd.session, 'ORDER BY r.created_at ASC, r.id ASC LIMIT')).toEqual([]);
  });
});
