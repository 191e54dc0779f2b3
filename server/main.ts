/** Process entry: check configuration and database, start the job queue, listen, close cleanly. */
import { loadConfig } from './config/config';
import { createSequelize } from './db/sequelize';
import { initModels } from './db/models';
import { createMigrator } from './db/migrate';
import { buildApp } from './app';
import type { Transaction } from 'sequelize';
import { createMailer, type OutgoingMail } from './mail/mailer';
import { enqueueMail, startMailQueue, startMailWorker } from './mail/mail-queue';
import { createPaymentClient } from './billing/payment-client';
import { startCalibrationDueJob } from './instruments/calibration-due-job';
import { closeHeavyPool } from './workers/heavy-pool';

async function main() {
  const config = loadConfig();
  const sequelize = createSequelize(config.databaseUrl, { poolMax: config.databasePoolSize });
  initModels(sequelize);
  await sequelize.authenticate();
  const pending = await createMigrator(sequelize).pending();
  if (pending.length) throw new Error(`database has ${pending.length} pending migration(s): run npm run db:migrate`);
  const boss = await startMailQueue(config.databaseUrl, { retryDelaySeconds: config.smtp.retryDelaySeconds });
  await startMailWorker(boss, createMailer(config.smtp));
  // Every sender enqueues the same way: in the caller's transaction, with the configured retry delay.
  const enqueue = (transaction: Transaction | null, mail: OutgoingMail) => enqueueMail(boss, transaction, mail, { retryDelaySeconds: config.smtp.retryDelaySeconds });
  await startCalibrationDueJob(boss, { sequelize, publicUrl: config.publicUrl, enqueueMail: enqueue });
  const app = buildApp({
    sequelize,
    tokens: { secret: config.jwtSecret, accessTtlSeconds: config.accessTokenTtlSeconds, refreshTtlSeconds: config.refreshTokenTtlSeconds },
    secureCookies: config.secureCookies,
    clientDistDir: config.clientDistDir,
    publicUrl: config.publicUrl,
    mail: { enqueue },
    reports: {
      sequelize,
      publicUrl: config.publicUrl,
      keyEncryptionSecret: config.keyEncryptionSecret,
      enqueueMail: enqueue,
    },
    billing: {
      sequelize,
      payments: createPaymentClient(config.payments),
      webhookSecret: config.payments.webhookSecret,
      publicUrl: config.publicUrl,
      enqueueMail: enqueue,
    },
  });
  const server = app.listen(config.port, config.host, () => {
    console.log(`Sidecheck API listening on http://${config.host}:${config.port}`);
  });
  const shutdown = async (signal: string) => {
    console.log(`${signal}: closing`);
    server.close();
    await boss.stop({ graceful: true, timeout: 5000 }).catch(() => undefined);
    await sequelize.close().catch(() => undefined);
    await closeHeavyPool().catch(() => undefined);
    process.exit(0);
  };
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}

main().catch((error) => {
  console.error(`Sidecheck failed to start: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
