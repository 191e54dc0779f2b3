/**
 * "PDF attached when the lab chooses": a lab administrator turns the attachment on or off, and
 * the report-issued e-mail, delivered through the real mailer to the SMTP stand-in and parsed
 * with mailparser, carries the signed PDF byte for byte, or only the link.
 */
import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { simpleParser } from 'mailparser';
import { startTestApp, type TestApp } from '../../test/support/test-app';
import { buildLabScenario, signIn } from '../../test/support/factories';
import { mailJobs } from '../billing/billing-stack.test-support';
import { createMailer } from '../mail/mailer';
import type { OutgoingMail } from '../mail/mailer';
import { startSmtpStandIn, type SmtpStandIn } from '../../fakes/smtp/start-smtp-stand-in';

jest.setTimeout(60_000);

let t: TestApp;
let smtp: SmtpStandIn;
let dataDir: string;
beforeAll(async () => {
  t = await startTestApp();
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sidecheck-mail-settings-'));
  smtp = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir });
});
afterAll(async () => {
  await smtp?.close();
  await t?.close();
  fs.rmSync(dataDir, { recursive: true, force: true });
});

/** A lab whose administrator sets the choice, and one run issued afterwards; answers the queued report mail. */
async function issueWith(attachPdfToEmail: boolean) {
  const s = await buildLabScenario(t.sequelize);
  const as = async (user: { email: string }) => {
    const { token } = await signIn(t.app, user.email);
    return (method: 'get' | 'post' | 'put', p: string, body?: object) => request(t.app)[method](`/api${p}`).set('Authorization', `Bearer ${token}`).set('X-Organization-Id', s.lab.id).send(body);
  };
  const admin = await as(s.admin);
  const engineer = await as(s.engineer);
  const reviewer = await as(s.reviewer);
  expect((await reviewer('put', '/organization/mail-settings', { attachPdfToEmail })).status).toBe(403);
  const saved = await admin('put', '/organization/mail-settings', { attachPdfToEmail });
  expect(saved.status).toBe(200);
  expect(saved.body).toEqual({ attachPdfToEmail });
  const run = (await engineer('post', '/runs', { planId: s.plan.id })).body;
  await engineer('put', `/runs/${run.id}/cases/${run.testCases[0].id}/reading`, { values: { pepDbm: 51, carrierDbm: 8.2 } });
  await engineer('post', `/runs/${run.id}/submit`);
  await reviewer('post', `/runs/${run.id}/approve`);
  const issued = await reviewer('post', `/runs/${run.id}/issue`);
  expect(issued.status).toBe(201);
  const [job] = await mailJobs(t, `Test report ${issued.body.reportNumber} `);
  return { s, report: issued.body as { id: string; sha256: string; reportNumber: string }, mail: job.data as unknown as OutgoingMail };
}

/** Deliver through the product's own mailer to the stand-in and parse what arrived. */
async function deliver(mail: OutgoingMail) {
  const mailer = createMailer({ host: '127.0.0.1', port: smtp.smtpPort, from: 'Sidecheck <no-reply@sidecheck.test>' });
  await mailer.send(mail);
  mailer.close();
  const list = (await (await fetch(`http://127.0.0.1:${smtp.httpPort}/api/messages?to=${encodeURIComponent(mail.to)}`)).json()) as { id: string; subject: string }[];
  const found = list.find((m) => m.subject === mail.subject)!;
  const raw = Buffer.from(await (await fetch(`http://127.0.0.1:${smtp.httpPort}/api/messages/${found.id}/raw`)).arrayBuffer());
  return simpleParser(raw);
}

describe('PUT /organization/mail-settings and the report-issued e-mail', () => {
  it('attaches the signed PDF, identical to the issued one, when the lab chooses it', async () => {
    const { s, report, mail } = await issueWith(true);
    const parsed = await deliver(mail);
    expect(parsed.to && 'text' in parsed.to ? parsed.to.text : '').toContain(s.client.contactEmail);
    expect(parsed.text).toContain('The signed report is attached to this message.');
    expect(parsed.attachments).toHaveLength(1);
    const [pdf] = parsed.attachments;
    expect(pdf.filename).toBe(`${report.reportNumber}.pdf`);
    expect(pdf.contentType).toBe('application/pdf');
    // The stored SHA-256 of the issued report (server/reports/report-service.ts) names these exact bytes.
    expect(crypto.createHash('sha256').update(pdf.content).digest('hex')).toBe(report.sha256);
  });

  it('sends only the link when the lab does not', async () => {
    const { mail } = await issueWith(false);
    expect(mail.attachments ?? []).toHaveLength(0);
    const parsed = await deliver(mail);
    expect(parsed.attachments).toHaveLength(0);
    expect(parsed.text).toContain('Sign in to Sidecheck to download the signed report.');
  });
});
