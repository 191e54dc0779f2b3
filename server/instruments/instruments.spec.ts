import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { Instrument } from '../db/models';
import { inTenant } from '../tenancy/tenant-transaction';
import { addDaysIso, todayIso } from './calibration-status';
import { callerFor, instrumentBody, type Caller } from './lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function lab() {
  const s = await buildLabScenario(t.sequelize);
  return { s, engineer: await callerFor(t.app, s.engineer, s.lab.id), reviewer: await callerFor(t.app, s.reviewer, s.lab.id) };
}

const count = (organizationId: string) => inTenant(t.sequelize, organizationId, () => Instrument.count());

describe('the equipment register', () => {
  it('adds, reads, lists and replaces an instrument, auditing the change with before and after', async () => {
    const { s, engineer, reviewer } = await lab();
    const body = instrumentBody(200);
    const created = await engineer('post', '/instruments', body);
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ ...body, calibrationStatus: 'valid' });

    const one = await reviewer('get', `/instruments/${created.body.id}`);
    expect(one.status).toBe(200);
    expect(one.body.serialNumber).toBe(body.serialNumber);

    // A new calibration: new dates and certificate, and a tighter figure on the certificate.
    const recalibrated = { ...body, calibratedOn: todayIso(), calibrationDue: addDaysIso(todayIso(), 20), certificateRef: 'CERT-NEW', contributions: [{ ...body.contributions[0], value: 0.25 }] };
    const put = await engineer('put', `/instruments/${created.body.id}`, recalibrated);
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ certificateRef: 'CERT-NEW', calibrationStatus: 'due-soon' });

    const [entry] = await t.sequelize.query<{ before: { certificateRef: string }; after: { certificateRef: string; contributions: { value: number }[] }; user_id: string }>(
      "SELECT before, after, user_id FROM audit_log WHERE entity = 'instrument' AND entity_id = :id AND action = 'update'",
      { replacements: { id: created.body.id }, type: QueryTypes.SELECT },
    );
    expect(entry.before.certificateRef).toBe(body.certificateRef);
    expect(entry.after.certificateRef).toBe('CERT-NEW');
    expect(entry.after.contributions[0].value).toBe(0.25);
    expect(entry.user_id).toBe(s.engineer.id);
  });

  it('computes the calibration status from today, filters by it and sorts on the server', async () => {
    const { engineer } = await lab();
    // 30-day warning window: common practice; due today is still in calibration (due date inclusive).
    const cases: [number, string][] = [[120, 'valid'], [31, 'valid'], [30, 'due-soon'], [0, 'due-soon'], [-1, 'overdue']];
    for (const [days] of cases) expect((await engineer('post', '/instruments', instrumentBody(days))).status).toBe(201);

    const all = await engineer('get', '/instruments?sort=-calibrationDue');
    expect(all.body.total).toBe(5);
    expect(all.body.items.map((i: { calibrationStatus: string }) => i.calibrationStatus)).toEqual(cases.map(([, status]) => status));

    const overdue = await engineer('get', '/instruments?status=overdue');
    expect(overdue.body.items.map((i: { calibrationDue: string }) => i.calibrationDue)).toEqual([addDaysIso(todayIso(), -1)]);
    const attention = await engineer('get', '/instruments?status=due-soon,overdue&sort=calibrationDue');
    expect(attention.body.items.map((i: { calibrationStatus: string }) => i.calibrationStatus)).toEqual(['overdue', 'due-soon', 'due-soon']);

    const paged = await engineer('get', '/instruments?sort=calibrationDue&pageSize=2&page=3');
    expect(paged.body).toMatchObject({ total: 5, page: 3, pageSize: 2 });
    expect(paged.body.items).toHaveLength(1);

    expect((await engineer('get', '/instruments?status=expired')).status).toBe(400);
    expect((await engineer('get', '/instruments?sort=password')).status).toBe(400);
  });

  it('refuses a second record of the same model and serial number with 409', async () => {
    const { s, engineer } = await lab();
    const body = instrumentBody(100);
    await engineer('post', '/instruments', body);
    const again = await engineer('post', '/instruments', { ...body, name: 'Another name' });
    expect(again.status).toBe(409);
    expect(again.body.code).toBe('instrument-exists');
    expect(await count(s.lab.id)).toBe(1);
  });

  const today = todayIso();
  it.each([
    ['a missing certificate', { certificateRef: undefined }, '/certificateRef'],
    ['an unknown field', { owner: 'me' }, '/owner'],
    ['a non-date', { calibrationDue: '31/12/2027' }, '/calibrationDue'],
    ['a calibration in the future', { calibratedOn: addDaysIso(today, 1), calibrationDue: addDaysIso(today, 300) }, '/calibratedOn'],
    ['a due date before the calibration', { calibratedOn: addDaysIso(today, -10), calibrationDue: addDaysIso(today, -20) }, '/calibrationDue'],
    ['an unknown budget', { contributions: [{ name: 'x', distribution: 'normal', value: 1, budget: 'phase' }] }, '/contributions/0/budget'],
    ['a negative half-width', { contributions: [{ name: 'x', distribution: 'rectangular', value: -1, budget: 'relative' }] }, '/contributions/0/value'],
    ['a zero coverage factor', { contributions: [{ name: 'x', distribution: 'normal', value: 1, coverageFactor: 0, budget: 'absolute' }] }, '/contributions/0/coverageFactor'],
    ['a contribution without its budget', { contributions: [{ name: 'x', distribution: 'normal', value: 1 }] }, '/contributions/0/budget'],
    ['an empty name', { name: '' }, '/name'],
  ])('refuses %s with 422 naming %s, on create and on replace, and stores nothing', async (_what, change, pointer) => {
    const { s, engineer } = await lab();
    const good = instrumentBody(100);
    const bad = { ...good, ...change };
    const created = await engineer('post', '/instruments', bad);
    expect(created.status).toBe(422);
    expect(created.headers['content-type']).toMatch(/problem\+json/);
    expect(created.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    expect(await count(s.lab.id)).toBe(0);

    const id = (await engineer('post', '/instruments', good)).body.id;
    const replaced = await engineer('put', `/instruments/${id}`, bad);
    expect(replaced.status).toBe(422);
    expect((await engineer('get', `/instruments/${id}`)).body).toMatchObject(good);
  });

  it('keeps each lab to its own register: another lab’s instrument answers 404 and is not listed', async () => {
    const a = await lab();
    const b = await lab();
    const theirs = (await b.engineer('post', '/instruments', instrumentBody(100))).body;
    expect((await a.engineer('get', `/instruments/${theirs.id}`)).status).toBe(404);
    const put = await a.engineer('put', `/instruments/${theirs.id}`, instrumentBody(50));
    expect(put.status).toBe(404);
    expect(JSON.stringify(put.body)).not.toContain(theirs.serialNumber);
    expect((await a.engineer('get', '/instruments')).body.items.map((i: { id: string }) => i.id)).not.toContain(theirs.id);
    expect((await b.engineer('get', `/instruments/${theirs.id}`)).body.certificateRef).toBe(theirs.certificateRef);
  });

  it('lets every lab role read the register and only admins and engineers write it', async () => {
    const { s, reviewer } = await lab();
    expect((await reviewer('get', '/instruments')).status).toBe(200);
    expect((await reviewer('post', '/instruments', instrumentBody(100))).status).toBe(403);
    const billing: Caller = await callerFor(t.app, s.billing, s.lab.id);
    expect((await billing('get', '/instruments')).status).toBe(200);
    expect(await count(s.lab.id)).toBe(0);
  });
});
