/** Process entry: check configuration and database, start the job queue, listen, close cleanly. */
import { loadConfig } from './config/config';
import { createSequelize } from './db/sequelize';
import { initModels } from './db/models';
import { createMigrator } from './db/migrate';
import { buildApp } from './app';
import { createMailer } from './mail/mailer';
import { enqueueMail, startMailQueue, startMailWorker } from './mail/mail-queue';
import { createPaymentClient } from './billing/payment-client';
import { startCalibrationDueJob } from './instruments/calibration-due-job';

async function main() {
  const config = loadConfig();
  const sequelize = createSequelize(config.databaseUrl);
  initModels(sequelize);
  await sequelize.authenticate();
  const pending = await createMigrator(sequelize).pending();
  if (pending.length) throw new Error(`database has ${pending.length} pending migration(s): run npm run db:migrate`);
  const boss = await startMailQueue(config.databaseUrl, { retryDelaySeconds: config.smtp.retryDelaySeconds });
  await startMailWorker(boss, createMailer(config.smtp));
  const mailRetry = { retryDelaySeconds: config.smtp.retryDelaySeconds };
  await startCalibrationDueJob(boss, { sequelize, publicUrl: config.publicUrl, enqueueMail: (transaction, mail) => enqueueMail(boss, transaction, mail, mailRetry) });
  const app = buildApp({
    sequelize,
    tokens: { secret: config.jwtSecret, accessTtlSeconds: config.accessTokenTtlSeconds, refreshTtlSeconds: config.refreshTokenTtlSeconds },
    secureCookies: config.secureCookies,
    clientDistDir: config.clientDistDir,
    publicUrl: config.publicUrl,
    mail: { enqueue: (transaction, mail) => enqueueMail(boss, transaction, mail, mailRetry) },
    reports: {
      sequelize,
      publicUrl: config.publicUrl,
      keyEncryptionSecret: config.keyEncryptionSecret,
      enqueueMail: (transaction, mail) => enqueueMail(boss, transaction, mail, mailRetry),
    },
    billing: {
      sequelize,
      payments: createPaymentClient(config.payments),
      webhookSecret: config.payments.webhookSecret,
      publicUrl: config.publicUrl,
      enqueueMail: (transaction, mail) => enqueueMail(boss, transaction, mail, mailRetry),
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
    process.exit(0);
  };
  process.on('SIGTERM', () => void shutdown('SIGTERM'));
  process.on('SIGINT', () => void shutdown('SIGINT'));
}

main().catch((error) => {
  console.error(`Sidecheck failed to start: ${error instanceof Error ? error.message : error}`);
  process.exit(1);
});
