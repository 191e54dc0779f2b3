/**
 * Process entry of the local stand-ins for hosted services (mail and payments). Started by the
 * product's start command and by end-to-end tests; `tsx fakes/main.ts` in development,
 * `node dist/server/fakes/main.js` once compiled. Prints one line per service with its URL and
 * closes both cleanly on SIGTERM or SIGINT.
 */
import { readFakesConfig } from './fakes-config';
import { startPaymentsStandIn } from './payments/start-payments-stand-in';
import { startSmtpStandIn } from './smtp/start-smtp-stand-in';

async function main(): Promise<void> {
  const config = readFakesConfig(process.env);
  const mail = await startSmtpStandIn({
    smtpPort: config.smtpPort,
    httpPort: config.smtpHttpPort,
    dataDir: config.mailDataDir,
  });
  const payments = await startPaymentsStandIn({
    port: config.paymentsPort,
    dataDir: config.paymentsDataDir,
    secretKey: config.paymentsSecretKey,
    webhookUrl: config.paymentsWebhookUrl,
    webhookSecret: config.paymentsWebhookSecret,
  }).catch(async (error: unknown) => {
    await mail.close();
    throw error;
  });

  console.log(
    `mail stand-in: smtp://127.0.0.1:${mail.smtpPort} inbox http://127.0.0.1:${mail.httpPort}/`,
  );
  console.log(
    `payments stand-in: http://127.0.0.1:${payments.port}/v1 webhooks ${config.paymentsWebhookUrl ?? 'none'}`,
  );

  let closing = false;
  const shutDown = (signal: NodeJS.Signals): void => {
    if (closing) return;
    closing = true;
    Promise.all([mail.close(), payments.close()]).then(
      () => {
        console.log(`stand-ins stopped (${signal})`);
        process.exit(0);
      },
      (error: unknown) => {
        console.error('stand-ins did not stop cleanly', error);
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', shutDown);
  process.on('SIGINT', shutDown);
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
