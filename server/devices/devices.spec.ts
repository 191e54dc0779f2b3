import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario } from '../../test/support/factories';
import { Report } from '../db/models';
import { asSystem } from '../tenancy/tenant-transaction';
import { callerFor } from '../instruments/lab-session.test-support';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function setup() {
  const s = await buildLabScenario(t.sequelize);
  const engineer = await callerFor(t.app, s.engineer, s.lab.id);
  const d = s.device;
  const body = {
    clientId: s.client.id,
    manufacturer: d.manufacturer,
    model: d.model,
    serialNumber: d.serialNumber,
    firmware: '1.1',
    ratedPepW: d.ratedPepW,
    emissionDesignator: d.emissionDesignator,
    frequencyMinHz: d.frequencyMinHz,
    frequencyMaxHz: d.frequencyMaxHz,
    modes: d.modes as ('USB' | 'LSB')[],
    receivedOn: d.receivedOn,
    condition: 'Front panel knob loose',
  };
  return { s, engineer, body };
}

/** A report row as issuing stores it (the PDF bytes do not matter to this rule), on a run of the device's plan. */
async function issueOn(s: Awaited<ReturnType<typeof buildLabScenario>>, runId: string): Promise<string> {
  const reportNumber = `TST-${crypto.randomBytes(3).toString('hex')}`;
  await asSystem(t.sequelize, (transaction) =>
    Report.create(
      { organizationId: s.lab.id, runId, clientOrganizationId: s.maker.id, reportNumber, verifyToken: crypto.randomBytes(18).toString('base64url'), sha256: '0'.repeat(64), pdf: Buffer.from('%PDF-1.7'), pageCount: 1, summary: {}, issuedBy: s.reviewer.id, replacesReportId: null, replacesReason: null },
      { transaction },
    ),
  );
  return reportNumber;
}

describe('PUT /api/devices/:id', () => {
  it('replaces the device record and audits it with before and after', async () => {
    const { s, engineer, body } = await setup();
    const res = await engineer('put', `/devices/${s.device.id}`, { ...body, serialNumber: 'SN-CORRECTED' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ firmware: '1.1', condition: 'Front panel knob loose', serialNumber: 'SN-CORRECTED' });
    const [entry] = await t.sequelize.query<{ before: { serialNumber: string }; after: { serialNumber: string } }>(
      "SELECT before, after FROM audit_log WHERE entity = 'device' AND action = 'update' AND entity_id = :id",
      { replacements: { id: s.device.id }, type: QueryTypes.SELECT },
    );
    expect(entry).toMatchObject({ before: { serialNumber: s.device.serialNumber }, after: { serialNumber: 'SN-CORRECTED' } });
  });

  it('keeps the identification of a device with an issued report (ISO/IEC 17025:2017 7.8.2.1 g) but allows other corrections', async () => {
    const { s, engineer, body } = await setup();
    const run = (await engineer('post', '/runs', { planId: s.plan.id })).body;
    const reportNumber = await issueOn(s, run.id);
    for (const change of [{ serialNumber: 'SN-OTHER' }, { model: 'TX-2' }, { manufacturer: 'Someone else' }]) {
      const res = await engineer('put', `/devices/${s.device.id}`, { ...body, ...change });
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('device-identification-locked');
      expect(res.body.detail).toContain(reportNumber);
    }
    expect((await engineer('get', `/devices/${s.device.id}`)).body.serialNumber).toBe(s.device.serialNumber);
    const ok = await engineer('put', `/devices/${s.device.id}`, { ...body, firmware: '1.2' });
    expect(ok.status).toBe(200);
    expect(ok.body.firmware).toBe('1.2');
  });

  it.each([
    ['a range upside down', { frequencyMinHz: 30e6, frequencyMaxHz: 2e6 }, '/frequencyMaxHz'],
    ['a bad emission designator', { emissionDesignator: '2K70Q9Z' }, '/emissionDesignator'],
    ['no rated power', { ratedPepW: 0 }, '/ratedPepW'],
    ['an unknown mode', { modes: ['AM'] }, '/modes/0'],
    ['an unknown field', { colour: 'grey' }, '/colour'],
  ])('refuses %s with 422 naming %s and changes nothing', async (_what, change, pointer) => {
    const { s, engineer, body } = await setup();
    const res = await engineer('put', `/devices/${s.device.id}`, { ...body, ...change });
    expect(res.status).toBe(422);
    expect(res.body.errors.map((e: { pointer: string }) => e.pointer)).toContain(pointer);
    expect((await engineer('get', `/devices/${s.device.id}`)).body.firmware).toBe(s.device.firmware);
  });

  it('answers 404 for another lab’s device and 422 for another lab’s client', async () => {
    const a = await setup();
    const b = await setup();
    expect((await a.engineer('put', `/devices/${b.s.device.id}`, a.body)).status).toBe(404);
    const res = await a.engineer('put', `/devices/${a.s.device.id}`, { ...a.body, clientId: b.s.client.id });
    expect(res.status).toBe(422);
    expect(res.body.errors[0].pointer).toBe('/clientId');
    expect((await a.engineer('get', `/devices/${a.s.device.id}`)).body.clientId).toBe(a.s.client.id);
  });
});
