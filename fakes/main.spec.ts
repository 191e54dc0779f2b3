import { spawn } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { readFakesConfig } from './fakes-config';

describe('readFakesConfig', () => {
  it('uses the documented defaults', () => {
    const config = readFakesConfig({});
    expect(config).toMatchObject({
      smtpPort: 1025,
      smtpHttpPort: 1080,
      paymentsPort: 12111,
      paymentsWebhookUrl: undefined,
    });
    expect(config.mailDataDir).toBe(resolve('.data/fakes/mail'));
  });

  it('rejects bad ports and a webhook URL without secret, naming the variable', () => {
    expect(() => readFakesConfig({ SMTP_PORT: '70000' })).toThrow(/^readFakesConfig: SMTP_PORT/);
    expect(() => readFakesConfig({ PAYMENTS_PORT: '12a' })).toThrow(RangeError);
    expect(() => readFakesConfig({ PAYMENTS_WEBHOOK_URL: 'http://127.0.0.1:1/h' })).toThrow(
      /PAYMENTS_WEBHOOK_SECRET/,
    );
  });
});

describe('fakes/main.ts as a process', () => {
  it('prints one URL line per service, serves, and exits 0 on SIGTERM', async () => {
    const dataDir = await mkdtemp(join(tmpdir(), 'fakes-main-'));
    const child = spawn(
      process.execPath,
      [require.resolve('tsx/cli'), join(__dirname, 'main.ts')],
      {
        env: {
          ...process.env,
          SMTP_PORT: '0',
          SMTP_HTTP_PORT: '0',
          PAYMENTS_PORT: '0',
          PAYMENTS_SECRET_KEY: 'sk_test_main_spec',
          FAKES_DATA_DIR: dataDir,
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      },
    );
    try {
      let output = '';
      child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
      child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
      const deadline = Date.now() + 15_000;
      while (!/payments stand-in: .*\n/.test(output) && Date.now() < deadline) {
        await new Promise((r) => setTimeout(r, 50));
      }
      const inbox = /inbox (http:\/\/127\.0\.0\.1:\d+\/)/.exec(output)?.[1];
      const payments = /payments stand-in: (http:\/\/127\.0\.0\.1:\d+)\/v1/.exec(output)?.[1];
      expect(inbox).toBeDefined();
      expect(payments).toBeDefined();
      expect(output).toMatch(/mail stand-in: smtp:\/\/127\.0\.0\.1:\d+/);
      expect((await fetch(inbox ?? '')).status).toBe(200);
      const unauthorised = await fetch(`${payments}/v1/customers`);
      expect(unauthorised.status).toBe(401);
      const authorised = await fetch(`${payments}/v1/customers`, {
        headers: { Authorization: 'Bearer sk_test_main_spec' },
      });
      expect(authorised.status).toBe(200);

      const exited = new Promise<number | null>((done) => child.on('exit', (code) => done(code)));
      child.kill('SIGTERM');
      expect(await exited).toBe(0);
      expect(output).toContain('stand-ins stopped (SIGTERM)');
    } finally {
      if (child.exitCode === null) child.kill('SIGKILL');
      await rm(dataDir, { recursive: true, force: true });
    }
  }, 30_000);
});
