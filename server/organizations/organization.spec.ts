/** GET/PUT /api/organization: the details a lab prints on its reports (ISO/IEC 17025:2017 7.8.2.1 b). */
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { callerFor } from '../instruments/lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

const body = { name: 'Tideway Radio Test Centre', addressLines: ['Unit 4, Pier Road', 'Saltmarsh SM1 2AB'], email: 'lab@tideway.example', phone: '+44 1632 960123', accreditation: 'Accreditation no. 9999 (invented)' };

it('reads and replaces the lab’s details, keeps the code and audits the change', async () => {
  const s = await buildLabScenario(t.sequelize);
  const admin = await callerFor(t.app, s.admin, s.lab.id);
  const before = await admin('get', '/organization');
  expect(before.status).toBe(200);
  expect(before.body).toMatchObject({ id: s.lab.id, kind: 'lab', name: s.lab.name });
  const res = await admin('put', '/organization', body);
  expect(res.status).toBe(200);
  expect(res.body).toEqual({ id: s.lab.id, kind: 'lab', code: before.body.code, ...body });
  expect((await admin('get', '/organization')).body).toMatchObject(body);
  const [entry] = await t.sequelize.query<{ before: { name: string }; after: { name: string } }>(
    "SELECT before, after FROM audit_log WHERE entity = 'organization' AND entity_id = :id",
    { replacements: { id: s.lab.id }, type: QueryTypes.SELECT },
  );
  expect(entry).toMatchObject({ before: { name: s.lab.name }, after: { name: body.name } });
});

it('lets every member read it but only an administrator change it', async () => {
  const s = await buildLabScenario(t.sequelize);
  const engineer = await callerFor(t.app, s.engineer, s.lab.id);
  expect((await engineer('get', '/organization')).body.name).toBe(s.lab.name);
  expect((await engineer('put', '/organization', body)).status).toBe(403);
});

it.each([
  ['an empty name', { ...body, name: '' }, '/name'],
  ['no address', { ...body, addressLines: [] }, '/addressLines'],
  ['a bad e-mail address', { ...body, email: 'not an address' }, '/email'],
  ['an unknown field (the code is fixed)', { ...body, code: 'HACK' }, '/code'],
  ['a number for a name', { ...body, name: 42 }, '/name'],
])('refuses %s with 422 naming %s and changes nothing', async (_what, bad, pointer) => {
  const s = await buildLabScenario(t.sequelize);
  const admin = await callerFor(t.app, s.admin, s.lab.id);
  const res = await admin('put', '/organization', bad);
  expect(res.status).toBe(422);
  expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
  expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
  expect((await admin('get', '/organization')).body.name).toBe(s.lab.name);
});

describe('GET /organization/mail-settings', () => {
  it('reads a choice never made as off, then what the administrator saved, keeping the lab’s other settings', async () => {
    const s = await buildLabScenario(t.sequelize);
    await t.sequelize.query("UPDATE organizations SET settings = '{\"testSite\": \"Screened room 1 (invented)\"}' WHERE id = :id", { replacements: { id: s.lab.id } });
    const admin = await callerFor(t.app, s.admin, s.lab.id);
    const first = await admin('get', '/organization/mail-settings');
    expect(first.status).toBe(200);
    expect(first.body).toEqual({ attachPdfToEmail: false });
    expect((await admin('put', '/organization/mail-settings', { attachPdfToEmail: true })).status).toBe(200);
    expect((await admin('get', '/organization/mail-settings')).body).toEqual({ attachPdfToEmail: true });
    const [row] = await t.sequelize.query<{ settings: Record<string, unknown> }>('SELECT settings FROM organizations WHERE id = :id', { replacements: { id: s.lab.id }, type: QueryTypes.SELECT });
    expect(row.settings).toEqual({ testSite: 'Screened room 1 (invented)', attachPdfToEmail: true });
    expect((await admin('put', '/organization/mail-settings', { attachPdfToEmail: false })).status).toBe(200);
    expect((await admin('get', '/organization/mail-settings')).body).toEqual({ attachPdfToEmail: false });
  });

  it('answers for the active lab only, and only to its administrator', async () => {
    const mine = await buildLabScenario(t.sequelize);
    const other = await buildLabScenario(t.sequelize);
    expect((await (await callerFor(t.app, other.admin, other.lab.id))('put', '/organization/mail-settings', { attachPdfToEmail: true })).status).toBe(200);
    expect((await (await callerFor(t.app, mine.admin, mine.lab.id))('get', '/organization/mail-settings')).body).toEqual({ attachPdfToEmail: false });
    // Naming an organization one is not a member of answers 404, as for every member route (server/access/route-access.spec.ts).
    expect((await (await callerFor(t.app, mine.admin, other.lab.id))('get', '/organization/mail-settings')).status).toBe(404);
    for (const user of [mine.engineer, mine.reviewer, mine.billing]) {
      expect((await (await callerFor(t.app, user, mine.lab.id))('get', '/organization/mail-settings')).status).toBe(403);
    }
  });
});
