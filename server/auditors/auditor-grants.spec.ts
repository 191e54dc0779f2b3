import crypto from 'node:crypto';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, buildUser, signIn } from '../../test/support/factories';
import { Client, Device, Report, ReportStatusChange, TestPlan, TestRun } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { callerFor } from '../accounts/api-caller.test-support';
import { recordingMail } from '../accounts/recording-mail.test-support';

const mail = recordingMail();
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ mail });
});
afterAll(() => t?.close());

let n = 0;
const auditorAddress = () => `auditor-${Date.now().toString(36)}-${++n}@test.example`;
const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);
const system = (sql: string, replacements: Record<string, unknown>) => asSystem(t.sequelize, (transaction) => t.sequelize.query(sql, { replacements, transaction }));

/** An issued report on a device's plan, written directly (the report module's own tests cover issuing). */
async function issuedReport(labId: string, planId: string, issuedBy: string, label: { client: string; device: string; lab: string }) {
  return asSystem(t.sequelize, async (transaction) => {
    const run = await TestRun.create({ organizationId: labId, planId, number: `RUN-A${++n}`, state: 'issued', engineerId: issuedBy }, { transaction });
    const pdf = Buffer.concat([Buffer.from('%PDF-1.7\n'), crypto.randomBytes(64)]);
    return Report.create(
      {
        organizationId: labId,
        runId: run.id,
        clientOrganizationId: null,
        reportNumber: `AUD-${n}`,
        replacesReportId: null,
        replacesReason: null,
        verifyToken: crypto.randomBytes(18).toString('base64url'),
        sha256: crypto.createHash('sha256').update(pdf).digest('hex'),
        pdf,
        pageCount: 1,
        summary: { lab: label.lab, client: label.client, device: label.device, serialNumber: 'SN-1', verdicts: ['pass'] },
        issuedBy,
      },
      { transaction },
    );
  });
}

/** A lab with two clients, one device each, one issued report per device. */
async function labWithReports() {
  const s = await buildLabScenario(t.sequelize);
  const other = await asSystem(t.sequelize, async (transaction) => {
    const client = await Client.create({ organizationId: s.lab.id, name: `Second client ${n}`, addressLines: [], contactName: 'C', contactEmail: 'c@test.example' }, { transaction });
    const device = await Device.create({ organizationId: s.lab.id, clientId: client.id, manufacturer: 'Other', model: 'RX-2', serialNumber: `S-${n}`, firmware: null, ratedPepW: 50, emissionDesignator: '2K70J3E', frequencyMinHz: 1.6e6, frequencyMaxHz: 30e6, modes: ['USB'], receivedOn: '2026-11-02', condition: 'Good' }, { transaction });
    const plan = await TestPlan.create({ organizationId: s.lab.id, deviceId: device.id, ruleSetId: s.plan.ruleSetId, ruleSetSnapshot: s.plan.ruleSetSnapshot, name: 'Plan 2' }, { transaction });
    return { client, device, plan };
  });
  const first = await issuedReport(s.lab.id, s.plan.id, s.reviewer.id, { lab: s.lab.name, client: s.client.name, device: 'Maker TX-1' });
  const second = await issuedReport(s.lab.id, other.plan.id, s.reviewer.id, { lab: s.lab.name, client: other.client.name, device: 'Other RX-2' });
  const admin = await callerFor(t.app, s.admin, s.lab.id);
  return { s, other, first, second, admin };
}

/** Grant, accept as a new account, and return the auditor's bearer token. */
async function grantAndAccept(admin: Awaited<ReturnType<typeof callerFor>>, body: Record<string, unknown>) {
  const email = auditorAddress();
  const grant = await admin('post', '/auditor-grants', { email, expiresOn: isoDay(30), ...body });
  expect(grant.status).toBe(201);
  const token = mail.tokenFrom(email, '/invitations/');
  const accepted = await request(t.app).post('/api/invitations/accept').send({ token, name: 'Audrey Auditor', password: 'a-long-password-88' });
  expect(accepted.status).toBe(200);
  const auditor = (method: 'get', path: string) => request(t.app)[method](`/api${path}`).set('Authorization', `Bearer ${accepted.body.accessToken}`);
  return { grantId: grant.body.id as string, email, token, accepted: accepted.body, auditor };
}
const reportIds = async (auditor: (m: 'get', p: string) => request.Test) => (await auditor('get', '/auditor/reports')).body.items.map((r: { id: string }) => r.id).sort();

describe('auditor grants', () => {
  it('an auditor invited to all issued reports sees them with lab, client, device, status and the PDF as issued', async () => {
    const { s, other, first, second, admin } = await labWithReports();
    const { email, accepted, auditor, grantId } = await grantAndAccept(admin, { scope: 'all', note: 'ISO/IEC 17025 surveillance visit' });
    expect(mail.lastTo(email).text).toContain('ISO/IEC 17025 surveillance visit');
    // The auditor's account has no membership anywhere.
    expect(accepted.user.memberships).toEqual([]);
    const list = await auditor('get', '/auditor/reports?sort=reportNumber');
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(2);
    expect(list.body.items).toEqual([
      expect.objectContaining({ id: first.id, reportNumber: first.reportNumber, lab: s.lab.name, client: s.client.name, device: 'Maker TX-1', status: 'current', verifyPath: `/verify/${first.verifyToken}` }),
      expect.objectContaining({ id: second.id, client: other.client.name, device: 'Other RX-2', status: 'current' }),
    ]);
    const pdf = await auditor('get', `/auditor/reports/${first.id}/pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    expect(pdf.headers['content-type']).toBe('application/pdf');
    expect((pdf.body as Buffer).equals(first.pdf)).toBe(true);
    // A withdrawn report stays visible, with its status.
    await asSystem(t.sequelize, (transaction) => ReportStatusChange.create({ organizationId: s.lab.id, reportId: second.id, status: 'withdrawn', reason: 'Wrong serial number', supersededById: null, changedBy: s.reviewer.id }, { transaction }));
    expect((await auditor('get', '/auditor/reports')).body.items).toContainEqual(expect.objectContaining({ id: second.id, status: 'withdrawn' }));
    const grants = await admin('get', '/auditor-grants');
    expect(grants.body.items).toContainEqual(expect.objectContaining({ id: grantId, email, scope: 'all', status: 'active' }));
  });

  it('a client scope covers that client’s reports only; a device scope that device’s only', async () => {
    const { s, other, first, second, admin } = await labWithReports();
    const byClient = await grantAndAccept(admin, { scope: 'client', clientId: s.client.id });
    expect(await reportIds(byClient.auditor)).toEqual([first.id]);
    expect((await byClient.auditor('get', `/auditor/reports/${second.id}/pdf`)).status).toBe(404);
    const byDevice = await grantAndAccept(admin, { scope: 'device', deviceId: other.device.id });
    expect(await reportIds(byDevice.auditor)).toEqual([second.id]);
  });

  it('expired or revoked: the reports disappear (404); a revoked grant’s open link dies too', async () => {
    const { first, admin } = await labWithReports();
    const expiring = await grantAndAccept(admin, { scope: 'all' });
    await system('UPDATE auditor_grants SET expires_on = current_date - 1 WHERE id = :id', { id: expiring.grantId });
    expect((await expiring.auditor('get', '/auditor/reports')).body.items).toEqual([]);
    expect((await expiring.auditor('get', `/auditor/reports/${first.id}/pdf`)).status).toBe(404);
    expect((await admin('get', '/auditor-grants?status=expired')).body.items.map((g: { id: string }) => g.id)).toContain(expiring.grantId);

    const revoking = await grantAndAccept(admin, { scope: 'all' });
    expect((await revoking.auditor('get', `/auditor/reports/${first.id}/pdf`)).status).toBe(200);
    expect((await admin('delete', `/auditor-grants/${revoking.grantId}`)).status).toBe(204);
    expect((await revoking.auditor('get', '/auditor/reports')).body.total).toBe(0);
    expect((await revoking.auditor('get', `/auditor/reports/${first.id}/pdf`)).status).toBe(404);

    const email = auditorAddress();
    const pending = await admin('post', '/auditor-grants', { email, scope: 'all', expiresOn: isoDay(10) });
    const token = mail.tokenFrom(email, '/invitations/');
    expect((await admin('delete', `/auditor-grants/${pending.body.id}`)).status).toBe(204);
    const late = await request(t.app).post('/api/invitations/accept').send({ token, name: 'Late', password: 'a-long-password-88' });
    expect(late.status).toBe(410);
    expect(late.body.code).toBe('invitation-revoked');
  });

  it('an existing account accepts without a new password and sees nothing before accepting', async () => {
    const { first, admin } = await labWithReports();
    const person = await buildUser(t.sequelize, null, []);
    const { token: bearer } = await signIn(t.app, person.email);
    const auditor = (path: string) => request(t.app).get(`/api${path}`).set('Authorization', `Bearer ${bearer}`);
    await admin('post', '/auditor-grants', { email: person.email, scope: 'all', expiresOn: isoDay(5) });
    expect((await auditor('/auditor/reports')).body.items).toEqual([]);
    const token = mail.tokenFrom(person.email, '/invitations/');
    const info = await request(t.app).get(`/api/invitations/lookup/${token}`);
    expect(info.body).toMatchObject({ kind: 'auditor', accountExists: true, grant: { scope: 'all', expiresOn: isoDay(5) } });
    const accepted = await request(t.app).post('/api/invitations/accept').send({ token });
    expect(accepted.body.accountCreated).toBe(false);
    expect((await auditor('/auditor/reports')).body.items.map((r: { id: string }) => r.id)).toContain(first.id);
  });

  it('keeps labs apart: a grant of one lab shows none of another’s reports, and grants stay with their lab', async () => {
    const a = await labWithReports();
    const b = await labWithReports();
    const { auditor, grantId } = await grantAndAccept(a.admin, { scope: 'all' });
    expect(await reportIds(auditor)).toEqual([a.first.id, a.second.id].sort());
    expect((await auditor('get', `/auditor/reports/${b.first.id}/pdf`)).status).toBe(404);
    expect((await b.admin('get', '/auditor-grants')).body.items.map((g: { id: string }) => g.id)).not.toContain(grantId);
    expect((await b.admin('delete', `/auditor-grants/${grantId}`)).status).toBe(404);
    expect((await auditor('get', '/auditor/reports')).body.total).toBe(2);
    // Someone with no grant at all sees an empty list.
    const stranger = await callerFor(t.app, b.s.engineer, b.s.lab.id);
    expect((await stranger('get', '/auditor/reports')).body).toMatchObject({ items: [], total: 0 });
    expect((await stranger('get', '/auditor/reports/not-a-uuid/pdf')).status).toBe(404);
  });

  it.each([
    ['scope client without clientId', { scope: 'client' }],
    ['a client of another lab', { scope: 'client', clientId: 'OTHER_CLIENT' }],
    ['scope all with a deviceId', { scope: 'all', deviceId: 'OWN_DEVICE' }],
    ['scope device with a clientId', { scope: 'device', deviceId: 'OWN_DEVICE', clientId: 'OWN_CLIENT' }],
    ['a last day in the past', { scope: 'all', expiresOn: isoDay(-1) }],
    ['a last day beyond three years', { scope: 'all', expiresOn: isoDay(4 * 366) }],
    ['an impossible date', { scope: 'all', expiresOn: '2027-02-30' }],
    ['an unknown scope', { scope: 'everything' }],
    ['an unknown field', { scope: 'all', canEdit: true }],
    ['a huge note', { scope: 'all', note: 'x'.repeat(501) }],
    ['a wrong type', { scope: 'all', expiresOn: 20270101 }],
    ['no e-mail', { scope: 'all', email: undefined }],
  ])('refuses %s with 422 and stores nothing', async (_what, overrides) => {
    const { s, other, admin } = await labWithReports();
    const foreign = await buildLabScenario(t.sequelize);
    const ids: Record<string, string> = { OTHER_CLIENT: foreign.client.id, OWN_DEVICE: other.device.id, OWN_CLIENT: s.client.id };
    const body = Object.fromEntries(Object.entries({ email: auditorAddress(), expiresOn: isoDay(30), ...overrides }).map(([k, v]) => [k, typeof v === 'string' && v in ids ? ids[v] : v]));
    const res = await admin('post', '/auditor-grants', JSON.parse(JSON.stringify(body)));
    expect(res.status).toBe(422);
    const rows = await asSystem(t.sequelize, (transaction) => t.sequelize.query('SELECT 1 FROM auditor_grants WHERE organization_id = :org', { replacements: { org: s.lab.id }, type: QueryTypes.SELECT, transaction }));
    expect(rows).toEqual([]);
  });
});
