import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { callerFor } from '../instruments/lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  return { s, engineer: await callerFor(t.app, s.engineer, s.lab.id), reviewer: await callerFor(t.app, s.reviewer, s.lab.id) };
}

const body = { name: 'Halyard Marine (renamed)', addressLines: ['3 New Quay', 'Harbourtown'], contactName: 'New Contact', contactEmail: 'new.contact@maker.example', invoiceLater: true };

describe('PUT /api/clients/:id', () => {
  it('replaces the client record and audits it with before and after', async () => {
    const { s, engineer } = await setup();
    const res = await engineer('put', `/clients/${s.client.id}`, body);
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject(body);
    expect((await engineer('get', `/clients/${s.client.id}`)).body).toMatchObject(body);
    const [entry] = await t.sequelize.query<{ before: { name: string }; after: { name: string }; user_id: string }>(
      "SELECT before, after, user_id FROM audit_log WHERE entity = 'client' AND action = 'update' AND entity_id = :id",
      { replacements: { id: s.client.id }, type: QueryTypes.SELECT },
    );
    expect(entry).toMatchObject({ before: { name: s.client.name }, after: { name: body.name }, user_id: s.engineer.id });
  });

  it('keeps the billing choice when the body leaves it out', async () => {
    const { s, engineer } = await setup();
    await engineer('put', `/clients/${s.client.id}`, body);
    const { invoiceLater: _omitted, ...rest } = body;
    expect((await engineer('put', `/clients/${s.client.id}`, rest)).body.invoiceLater).toBe(true);
  });

  it.each([
    ['a bad e-mail address', { ...body, contactEmail: 'not an address' }, '/contactEmail'],
    ['an empty name', { ...body, name: '' }, '/name'],
    ['seven address lines', { ...body, addressLines: ['1', '2', '3', '4', '5', '6', '7'] }, '/addressLines'],
    ['an unknown field', { ...body, organizationId: '00000000-0000-4000-8000-000000000000' }, '/organizationId'],
    ['a missing contact', { name: 'x', addressLines: [], contactEmail: 'a@b.example' }, '/contactName'],
  ])('refuses %s with 422 naming %s and changes nothing', async (_what, bad, pointer) => {
    const { s, engineer } = await setup();
    const res = await engineer('put', `/clients/${s.client.id}`, bad);
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    expect((await engineer('get', `/clients/${s.client.id}`)).body.name).toBe(s.client.name);
  });

  it('answers 404 for another lab’s client and 403 for a reviewer', async () => {
    const a = await setup();
    const b = await setup();
    expect((await a.engineer('put', `/clients/${b.s.client.id}`, body)).status).toBe(404);
    expect((await b.engineer('get', `/clients/${b.s.client.id}`)).body.name).toBe(b.s.client.name);
    expect((await a.reviewer('put', `/clients/${a.s.client.id}`, body)).status).toBe(403);
  });
});
