import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { inTenant } from '../tenancy/tenant-transaction';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(() => t?.close());

async function approvedRun() {
  const s = await buildLabScenario(t.sequelize);
  const as = async (user: { email: string }, org = s.lab.id) => {
    const { token } = await signIn(t.app, user.email);
    return (method: 'get' | 'post' | 'put', p: string, body?: object) => request(t.app)[method](`/api${p}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', org).send(body);
  };
  const engineer = await as(s.engineer);
  const reviewer = await as(s.reviewer);
  const run = (await engineer('post', '/runs', { planId: s.plan.id })).body;
  await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 8.2 } });
  await engineer('post', `/runs/${run.id}/submit`);
  await reviewer('post', `/runs/${run.id}/approve`);
  return { s, engineer, reviewer, run, as };
}

describe('issuing a report', () => {
  it('issues a signed PDF in the same transaction as the state change, visible to the client manufacturer', async () => {
    const { s, reviewer, run, as } = await approvedRun();
    const issued = await reviewer('post', `/runs/${run.id}/issue`);
    if (issued.status !== 201) console.error(JSON.stringify(t.logs.slice(-1)));
    expect(issued.status).toBe(201);
    expect(issued.body.reportNumber).toMatch(/^T[0-9A-Z]{7}-\d{4}-0001$/);
    expect(issued.body.sha256).toMatch(/^[0-9a-f]{64}$/);
    const detail = await reviewer('get', `/runs/${run.id}`);
    expect(detail.body.state).toBe('issued');

    const pdf = await reviewer('get', `/reports/${issued.body.id}/pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    const bytes = pdf.body as Buffer;
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-report-')), 'report.pdf');
    fs.writeFileSync(file, bytes);
    // pdftotext (poppler): the device, the test, the value and the verdict are in the text.
    const text = execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
    expect(text).toContain(s.device.serialNumber);
    expect(text).toContain('TX-1 test radio');
    expect(text).toMatch(/Carrier suppression/);
    expect(text).toMatch(/42\.8/);
    expect(text).toMatch(/Pass/);
    // pdfsig reads the embedded PKCS#7 signature (it exits 0 either way: read its text).
    const sig = execFileSync('pdfsig', [file], { encoding: 'utf8' });
    expect(sig).toContain('Signature is Valid.');
    expect(sig).toContain('Total document signed');

    // The certificate refers to the report by number and is signed too.
    const cert = await reviewer('get', `/reports/${issued.body.id}/certificate`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(cert.status).toBe(200);
    const certFile = file.replace('report.pdf', 'certificate.pdf');
    fs.writeFileSync(certFile, cert.body as Buffer);
    expect(execFileSync('pdftotext', [certFile, '-'], { encoding: 'utf8' })).toContain(issued.body.reportNumber);
    expect(execFileSync('pdfsig', [certFile], { encoding: 'utf8' })).toContain('Signature is Valid.');

    // The manufacturer client sees it, with the same bytes.
    const maker = await as(s.makerAdmin, s.maker.id);
    const list = await maker('get', '/reports');
    expect(list.body.items.map((r: { id: string }) => r.id)).toContain(issued.body.id);

    // The public verification answer, without sign-in.
    const verify = await request(t.app).get(`/api${issued.body.verifyPath}`);
    expect(verify.status).toBe(200);
    expect(verify.body).toMatchObject({ reportNumber: issued.body.reportNumber, status: 'current', sha256: issued.body.sha256 });

    // The client's e-mail was enqueued in the same transaction.
    const [jobs] = await t.sequelize.query(`SELECT data FROM pgboss.job WHERE name = 'mail' AND data->>'subject' LIKE :subject`, { replacements: { subject: `%${issued.body.reportNumber}%` } });
    expect(jobs).toHaveLength(1);
  });

  it('keeps issued reports immutable in the database: a plain SQL UPDATE is refused by the trigger', async () => {
    const { s, reviewer, run } = await approvedRun();
    const issued = await reviewer('post', `/runs/${run.id}/issue`);
    await expect(
      inTenant(t.sequelize, s.lab.id, () => t.sequelize.query(`UPDATE reports SET sha256 = 'x' WHERE id = :id`, { replacements: { id: issued.body.id } })),
    ).rejects.toThrow(/immutable/);
    await expect(inTenant(t.sequelize, s.lab.id, () => t.sequelize.query(`DELETE FROM reports WHERE id = :id`, { replacements: { id: issued.body.id } }))).rejects.toThrow(/immutable/);
  });

  it('refuses to issue a run that is not authorized, and issues only once', async () => {
    const { reviewer, run } = await approvedRun();
    expect((await reviewer('post', `/runs/${run.id}/issue`)).status).toBe(201);
    const again = await reviewer('post', `/runs/${run.id}/issue`);
    expect(again.status).toBe(409);
  });
});

describe('withdrawal and correction (ISO/IEC 17025:2017 7.8.8)', () => {
  it('withdraws with a reason, keeps the record, and the verify page says so', async () => {
    const { reviewer, run } = await approvedRun();
    const issued = (await reviewer('post', `/runs/${run.id}/issue`)).body;
    expect((await reviewer('post', `/reports/${issued.id}/withdraw`, {})).status).toBe(422);
    const res = await reviewer('post', `/reports/${issued.id}/withdraw`, { reason: 'Wrong serial number recorded' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('withdrawn');
    const verify = await request(t.app).get(`/api${issued.verifyPath}`);
    expect(verify.body).toMatchObject({ status: 'withdrawn', reason: 'Wrong serial number recorded' });
    expect((await reviewer('post', `/reports/${issued.id}/withdraw`, { reason: 'again' })).status).toBe(409);
    expect((await reviewer('get', `/runs/${run.id}`)).body.state).toBe('withdrawn');
  });

  it('a correction issues revision 2 with the same number, stating what it replaces and why; revision 1 reads superseded', async () => {
    const { engineer, reviewer, run } = await approvedRun();
    const first = (await reviewer('post', `/runs/${run.id}/issue`)).body;
    const reopened = await reviewer('post', `/runs/${run.id}/revise`, { reason: 'Carrier re-measured with 10 Hz RBW' });
    expect(reopened.body.state).toBe('testing');
    await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 7.9 } });
    await engineer('post', `/runs/${run.id}/submit`);
    await reviewer('post', `/runs/${run.id}/approve`);
    const second = await reviewer('post', `/runs/${run.id}/issue`);
    expect(second.status).toBe(201);
    expect(second.body.reportNumber).toBe(first.reportNumber);
    expect(second.body.revision).toBe(2);
    const old = await request(t.app).get(`/api${first.verifyPath}`);
    expect(old.body).toMatchObject({ status: 'superseded', reason: 'Carrier re-measured with 10 Hz RBW', supersededBy: { reportNumber: first.reportNumber, revision: 2 } });
    const pdf = await reviewer('get', `/reports/${second.body.id}/pdf`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-rev-')), 'r.pdf');
    fs.writeFileSync(file, pdf.body as Buffer);
    const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('Carrier re-measured with 10 Hz RBW');
    expect(text).toContain(`${first.reportNumber} revision 1`);
  });
});
