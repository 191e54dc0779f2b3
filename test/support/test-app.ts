/**
 * The real application on the real test database (TEST_DATABASE_URL, created by the test
 * command), for supertest. Nothing of ours is mocked; mail goes into the real pg-boss queue.
 */
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import type PgBoss from 'pg-boss';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { migrateUp } from '../../server/db/migrate';
import { buildApp } from '../../server/app';
import { enqueueMail, startMailQueue } from '../../server/mail/mail-queue';
import { ensureBuiltInRuleSets } from '../../server/demo/seed';
import type { MailSender } from '../../server/accounts/account-deps';
import { createPaymentClient } from '../../server/billing/payment-client';

/** Where the billing routes find the payment API (a fakes/payments stand-in); by default nowhere (port 1 refuses). */
export interface TestPayments {
  port: number;
  secretKey: string;
  webhookSecret: string;
}

export interface TestApp {
  app: Express;
  sequelize: Sequelize;
  boss: PgBoss;
  logs: Record<string, unknown>[];
  close(): Promise<void>;
}

export const TEST_JWT_SECRET = 'test-only-jwt-secret-0123456789abcdef';

export function testDatabaseUrl(): string {
  const url = process.env.TEST_DATABASE_URL ?? process.env.DATABASE_URL;
  if (!url) throw new Error('TEST_DATABASE_URL is not set: run the suite with `npm test`');
  return url;
}

/**
 * Options: `mail` replaces the real queue for the people-and-access routes (a test that reads the
 * e-mails passes a recording sender); without it, their mail goes into pg-boss like all other mail.
 */
export async function startTestApp(options: { accessTtlSeconds?: number; mail?: MailSender; payments?: TestPayments; secureCookies?: boolean } = {}): Promise<TestApp> {
  const url = testDatabaseUrl();
  const sequelize = createSequelize(url, { poolMax: 5 });
  initModels(sequelize);
  await migrateUp(sequelize);
  await ensureBuiltInRuleSets(sequelize);
  const boss = await startMailQueue(url);
  const logs: Record<string, unknown>[] = [];
  const enqueue: MailSender['enqueue'] = (transaction, mail) => enqueueMail(boss, transaction, mail);
  const app = buildApp({
    sequelize,
    tokens: { secret: TEST_JWT_SECRET, accessTtlSeconds: options.accessTtlSeconds ?? 600, refreshTtlSeconds: 3600 },
    secureCookies: options.secureCookies ?? false,
    log: (entry) => logs.push(entry),
    publicUrl: 'http://127.0.0.1:4610',
    mail: options.mail ?? { enqueue },
    reports: {
      sequelize,
      publicUrl: 'http://127.0.0.1:4610',
      keyEncryptionSecret: 'test-only-key-encryption-secret',
      enqueueMail: enqueue,
    },
    billing: {
      sequelize,
      payments: createPaymentClient(
        { secretKey: options.payments?.secretKey ?? 'sk_test_nowhere', host: '127.0.0.1', port: options.payments?.port ?? 1, protocol: 'http', webhookSecret: '' },
        { maxNetworkRetries: 0 },
      ),
      webhookSecret: options.payments?.webhookSecret ?? 'whsec_test_only',
      publicUrl: 'http://127.0.0.1:4610',
      enqueueMail: enqueue,
    },
  });
  return {
    app,
    sequelize,
    boss,
    logs,
    async close() {
      await boss.stop({ graceful: false, wait: true, timeout: 2000 } as never).catch(() => undefined);
      await sequelize.close();
    },
  };
}
