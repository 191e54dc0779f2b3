import { join, resolve } from 'node:path';

/** Configuration of the stand-in process, read from the environment. */
export type FakesConfig = {
  smtpPort: number;
  smtpHttpPort: number;
  paymentsPort: number;
  paymentsSecretKey: string;
  paymentsWebhookUrl: string | undefined;
  paymentsWebhookSecret: string | undefined;
  mailDataDir: string;
  paymentsDataDir: string;
};

/** Secret key used when PAYMENTS_SECRET_KEY is unset; the app's development default must match. */
export const DEFAULT_PAYMENTS_SECRET_KEY = 'sk_test_sidecheck_local';

/**
 * Reads the stand-ins' configuration: SMTP_PORT (default 1025), SMTP_HTTP_PORT (1080),
 * PAYMENTS_PORT (12111), PAYMENTS_SECRET_KEY, PAYMENTS_WEBHOOK_URL (optional, comma-separated),
 * PAYMENTS_WEBHOOK_SECRET (required with a webhook URL), FAKES_DATA_DIR (default ./.data/fakes;
 * mail/ and payments/ inside). Port 0 picks a free port.
 *
 * @param env - the environment, normally process.env.
 * @returns the checked configuration.
 * @throws RangeError "readFakesConfig: …" naming the variable for a bad port or a missing secret.
 * @example readFakesConfig({ SMTP_PORT: '0' }).smtpPort === 0
 */
export function readFakesConfig(env: NodeJS.ProcessEnv): FakesConfig {
  const dataDir = resolve(env['FAKES_DATA_DIR'] || '.data/fakes');
  const webhookUrl = env['PAYMENTS_WEBHOOK_URL'] || undefined;
  const webhookSecret = env['PAYMENTS_WEBHOOK_SECRET'] || undefined;
  if (webhookUrl && !webhookSecret) {
    throw new RangeError(
      'readFakesConfig: PAYMENTS_WEBHOOK_SECRET is required when PAYMENTS_WEBHOOK_URL is set',
    );
  }
  return {
    smtpPort: port(env, 'SMTP_PORT', 1025),
    smtpHttpPort: port(env, 'SMTP_HTTP_PORT', 1080),
    paymentsPort: port(env, 'PAYMENTS_PORT', 12111),
    paymentsSecretKey: env['PAYMENTS_SECRET_KEY'] || DEFAULT_PAYMENTS_SECRET_KEY,
    paymentsWebhookUrl: webhookUrl,
    paymentsWebhookSecret: webhookSecret,
    mailDataDir: join(dataDir, 'mail'),
    paymentsDataDir: join(dataDir, 'payments'),
  };
}

function port(env: NodeJS.ProcessEnv, name: string, fallback: number): number {
  const text = env[name];
  if (text === undefined || text === '') return fallback;
  const value = Number(text);
  if (!/^[0-9]+$/.test(text) || value > 65535) {
    throw new RangeError(`readFakesConfig: ${name} must be a port number 0..65535, got '${text}'`);
  }
  return value;
}
