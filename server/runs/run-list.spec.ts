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
import { asSystem } from '../tenancy/tenant-transaction';

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
});
