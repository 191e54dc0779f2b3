import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import type { MessageJson } from './message-json';
import { startSmtpStandIn, type SmtpStandIn } from './start-smtp-stand-in';

describe('inbox pages', () => {
  let dataDir: string;
  let standIn: SmtpStandIn;
  let base: string;
  let message: MessageJson;

  beforeAll(async () => {
    dataDir = await mkdtemp(join(tmpdir(), 'inbox-pages-'));
    standIn = await startSmtpStandIn({ smtpPort: 0, httpPort: 0, dataDir });
    base = `http://127.0.0.1:${standIn.httpPort}`;
    await nodemailer
      .createTransport({
        host: '127.0.0.1',
        port: standIn.smtpPort,
        secure: false,
        ignoreTLS: true,
      })
      .sendMail({
        from: 'no-reply@sidecheck.test',
        to: 'viewer@lab.test',
        subject: 'Invite <script>alert(1)</script>',
        text: 'plain part',
        html: '<p>Logo: <img src="cid:logo@sidecheck"></p><script>alert(2)</script>',
        attachments: [
          { filename: 'logo.png', content: Buffer.from('89504e47', 'hex'), cid: 'logo@sidecheck' },
        ],
      });
    [message] = (await (await fetch(`${base}/api/messages`)).json()) as MessageJson[];
  });

  afterAll(async () => {
    await standIn.close();
    await rm(dataDir, { recursive: true, force: true });
  });

  it('lists messages with escaped subjects and a strict CSP, no script', async () => {
    const response = await fetch(`${base}/`);
    const html = await response.text();
    expect(response.headers.get('content-security-policy')).toContain("default-src 'none'");
    expect(html).toContain('Invite &lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).not.toMatch(/<script/i);
    expect(html).toContain(`/messages/${message.id}`);
  });

  it('shows one message with its HTML part in a sandboxed iframe served separately', async () => {
    const page = await (await fetch(`${base}/messages/${message.id}`)).text();
    expect(page).toContain(`<iframe sandbox src="/messages/${message.id}/html"`);
    expect(page).toContain('plain part');
    expect(page).toContain(`/api/messages/${message.id}/attachments/0`);

    const body = await fetch(`${base}/messages/${message.id}/html`);
    // The CSP sandbox directive (CSP Level 2 §7.17) disables the mail's script even when opened
    // outside the iframe.
    expect(body.headers.get('content-security-policy')).toMatch(/^sandbox;/);
    const bodyHtml = await body.text();
    expect(bodyHtml).toContain(`src="/api/messages/${message.id}/attachments/0"`);
    // The API keeps the HTML as sent; only the preview rewrites cid: links.
    expect(message.html).toContain('cid:logo@sidecheck');
  });

  it('serves its own style sheet and a 404 page for unknown messages', async () => {
    const css = await fetch(`${base}/inbox.css`);
    expect(css.headers.get('content-type')).toContain('text/css');
    expect((await fetch(`${base}/messages/nope`)).status).toBe(404);
  });

  it('deletes everything from the page form and redirects back (303)', async () => {
    const response = await fetch(`${base}/messages/delete`, { method: 'POST', redirect: 'manual' });
    expect(response.status).toBe(303);
    expect(response.headers.get('location')).toBe('/');
    expect(await (await fetch(`${base}/api/messages`)).json()).toEqual([]);
  });
});
