import { createHash } from 'node:crypto';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import type Mail from 'nodemailer/lib/mailer';
import type { MessageDetailJson, MessageJson } from './message-json';
import { startSmtpStandIn, type SmtpStandIn } from './start-smtp-stand-in';

// Every check goes through the real client (nodemailer over SMTP) and plain HTTP, never through
// the stand-in's own modules, so it fails if the protocol side is wrong.

/** Bytes 0..255 repeated: every octet value, so any 7-bit or charset mangling shows. */
const BINARY_ATTACHMENT = Buffer.from(Array.from({ length: 4096 }, (_, index) => index % 256));
const sha256 = (bytes: Buffer): string => createHash('sha256').update(bytes).digest('hex');

describe('SMTP stand-in', () => {
  let dataDir: string;
  let standIn: SmtpStandIn;
  let api: string;

  const send = (message: Mail.Options) =>
    nodemailer
      .createTransport({
        host: '127.0.0.1',
        port: standIn.smtpPort,
        secure: false,
        ignoreTLS: true, // the stand-in offers no STARTTLS (see start-smtp-stand-in.ts)
        connectionTimeout: 2000,
        greetingTimeout: 2000,
        socketTimeout: 5000,
      })
      .sendMail(message);

  const getJson = async <T>(path: string): Promise<T> => {
    const response = await fetch(`${api}${path}`);
    expect(response.status).toBe(200);
    return (await response.json()) as T;
  };

  beforeEach(async () => {
    dataDir = await mkdtemp(join(tmpdir(), 'smtp-stand-in-'));
    standIn = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir });
    api = `http://127.0.0.1:${standIn.httpPort}`;
  });

  afterEach(async () => {
    await standIn.close();
    await rm(dataDir, { recursive: true, force: true });
  });

  it('reports the ephemeral ports it bound', () => {
    expect(standIn.smtpPort).toBeGreaterThan(0);
    expect(standIn.httpPort).toBeGreaterThan(0);
    expect(standIn.smtpPort).not.toBe(standIn.httpPort);
  });

  it('receives text, HTML and a binary attachment byte-identical', async () => {
    const info = await send({
      from: 'Sidecheck <no-reply@sidecheck.test>',
      to: 'Lab Manager <manager@lab.test>',
      subject: 'Report R-001 signed — ±0.5 dB',
      text: 'Your report is attached.\nUnwanted sideband: −52 dBc',
      html: '<p>Your report is <b>attached</b>.</p>',
      attachments: [
        {
          filename: 'r-001.bin',
          content: BINARY_ATTACHMENT,
          contentType: 'application/octet-stream',
        },
      ],
    });
    // nodemailer's own account of what it sent is the reference for envelope and Message-ID.
    expect(info.accepted).toEqual(['manager@lab.test']);

    const [summary] = await getJson<MessageJson[]>('/api/messages?to=manager@lab.test');
    expect(summary.messageId).toBe(info.messageId);
    expect(summary.from).toBe('no-reply@sidecheck.test');
    expect(summary.to).toEqual(['manager@lab.test']);
    expect(summary.subject).toBe('Report R-001 signed — ±0.5 dB');
    expect(summary.text?.trim()).toBe('Your report is attached.\nUnwanted sideband: −52 dBc');
    expect(summary.html).toBe('<p>Your report is <b>attached</b>.</p>');
    expect(summary.envelope).toEqual({
      mailFrom: 'no-reply@sidecheck.test',
      rcptTo: ['manager@lab.test'],
      authUser: null,
    });
    expect(summary.attachments).toHaveLength(1);
    expect(summary.attachments[0]).toMatchObject({
      filename: 'r-001.bin',
      contentType: 'application/octet-stream',
      size: BINARY_ATTACHMENT.length,
    });

    const download = await fetch(summary.attachments[0].url);
    expect(download.headers.get('content-type')).toBe('application/octet-stream');
    expect(download.headers.get('content-disposition')).toContain('r-001.bin');
    expect(sha256(Buffer.from(await download.arrayBuffer()))).toBe(sha256(BINARY_ATTACHMENT));

    const raw = await (await fetch(`${api}/api/messages/${summary.id}/raw`)).text();
    expect(raw).toContain(`Message-ID: ${info.messageId}`);

    const detail = await getJson<MessageDetailJson>(`/api/messages/${summary.id}`);
    expect(detail.headers.find((header) => header.name.toLowerCase() === 'message-id')?.value).toBe(
      info.messageId,
    );
  });

  it('accepts clients that log in (AUTH PLAIN/LOGIN over plain SMTP) as well as anonymous ones', async () => {
    const info = await nodemailer
      .createTransport({
        host: '127.0.0.1',
        port: standIn.smtpPort,
        secure: false,
        ignoreTLS: true,
        auth: { user: 'sidecheck', pass: 'any-password' },
      })
      .sendMail({ from: 'a@sidecheck.test', to: 'auth@lab.test', subject: 'with auth', text: 'x' });
    expect(info.accepted).toEqual(['auth@lab.test']);
    const [message] = await getJson<MessageJson[]>('/api/messages?to=auth@lab.test');
    expect(message.envelope.authUser).toBe('sidecheck');
  });

  it('filters by recipient (envelope covers Bcc) and lists newest first', async () => {
    await send({ from: 'a@sidecheck.test', to: 'one@lab.test', subject: 'first', text: '1' });
    await send({
      from: 'a@sidecheck.test',
      to: 'two@lab.test',
      bcc: 'audit@lab.test',
      subject: 'second',
      text: '2',
    });
    await send({ from: 'a@sidecheck.test', to: 'ONE@lab.test', subject: 'third', text: '3' });

    const all = await getJson<MessageJson[]>('/api/messages');
    expect(all.map((message) => message.subject)).toEqual(['third', 'second', 'first']);
    const toOne = await getJson<MessageJson[]>('/api/messages?to=one@lab.test');
    expect(toOne.map((message) => message.subject)).toEqual(['third', 'first']);
    const toAudit = await getJson<MessageJson[]>('/api/messages?to=audit@lab.test');
    expect(toAudit.map((message) => message.subject)).toEqual(['second']);
    // Bcc must not leak into the headers (RFC 5322 §3.6.3); only the envelope knows it.
    expect(toAudit[0].to).toEqual(['two@lab.test']);
  });

  it('keeps messages across a restart with the same data folder', async () => {
    await send({
      from: 'a@sidecheck.test',
      to: 'keep@lab.test',
      subject: 'kept',
      text: 'x',
      attachments: [{ filename: 'k.bin', content: BINARY_ATTACHMENT }],
    });
    await standIn.close();
    standIn = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir });
    api = `http://127.0.0.1:${standIn.httpPort}`;

    const [message] = await getJson<MessageJson[]>('/api/messages?to=keep@lab.test');
    expect(message.subject).toBe('kept');
    const bytes = Buffer.from(await (await fetch(message.attachments[0].url)).arrayBuffer());
    expect(sha256(bytes)).toBe(sha256(BINARY_ATTACHMENT));
  });

  it('deletes all messages, also from disk', async () => {
    await send({ from: 'a@sidecheck.test', to: 'x@lab.test', subject: 'gone', text: 'x' });
    expect((await fetch(`${api}/api/messages`, { method: 'DELETE' })).status).toBe(204);
    expect(await getJson<MessageJson[]>('/api/messages')).toEqual([]);
    await standIn.close();
    standIn = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir });
    api = `http://127.0.0.1:${standIn.httpPort}`;
    expect(await getJson<MessageJson[]>('/api/messages')).toEqual([]);
  });

  it('answers 404 for unknown messages and attachments', async () => {
    expect((await fetch(`${api}/api/messages/0000000000000-00000000`)).status).toBe(404);
    await send({ from: 'a@sidecheck.test', to: 'x@lab.test', subject: 's', text: 'x' });
    const [message] = await getJson<MessageJson[]>('/api/messages');
    expect((await fetch(`${api}/api/messages/${message.id}/attachments/0`)).status).toBe(404);
    expect((await fetch(`${api}/api/messages/${message.id}/attachments/-1`)).status).toBe(404);
  });

  it('rejects a message over the size limit with 552 (RFC 5321 §4.5.3.1.10)', async () => {
    await standIn.close();
    standIn = await startSmtpStandIn({
      smtpPort: 0,
      httpPort: 0,
      dataDir,
      maxMessageBytes: 10_000,
    });
    await expect(
      send({
        from: 'a@sidecheck.test',
        to: 'x@lab.test',
        subject: 'big',
        text: 'x'.repeat(50_000),
      }),
    ).rejects.toMatchObject({ responseCode: 552 });
  });
});
