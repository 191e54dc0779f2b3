/**
 * A throwaway PostgreSQL cluster of a fault test (scripts/pg-cluster.sh with its own PG_DIR under
 * .data/ and its own port), so a test may stop, restart or restore a database without touching
 * the suite's shared cluster. initdb + start + createdb take about 2 s here.
 */
import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import { createSequelize } from '../../server/db/sequelize';
import { initModels } from '../../server/db/models';
import { migrateUp } from '../../server/db/migrate';
import { ensureBuiltInRuleSets } from '../../server/demo/seed';
import { startMailQueue } from '../../server/mail/mail-queue';
import { ROOT } from './processes';

const run = promisify(execFile);

export interface PrivateCluster {
  /** The folder given to scripts/pg-cluster.sh as PG_DIR. */
  dir: string;
  port: number;
  database: string;
  /** The application role's URL (neither superuser nor BYPASSRLS). */
  url: string;
  superuserUrl: string;
  /** Environment for scripts that take the cluster from PG_DIR, PG_PORT and PG_DB. */
  env: Record<string, string>;
  start(): Promise<void>;
  /** pg_ctl stop -m fast: open connections are terminated (57P01), new ones refused. */
  stop(): Promise<void>;
  destroy(): Promise<void>;
}

async function cluster(env: Record<string, string>, command: string): Promise<string> {
  const { stdout } = await run('bash', [path.join(ROOT, 'scripts', 'pg-cluster.sh'), command], { cwd: ROOT, env: { ...process.env, PG_FSYNC: 'off', ...env } });
  return stdout.trim();
}

/** A fresh cluster in `.data/<name>` on `port` (any leftover of an earlier run is destroyed first), started. */
export async function createPrivateCluster(name: string, port: number, database = 'sidecheck'): Promise<PrivateCluster> {
  const dir = path.join(ROOT, '.data', name);
  const env = { PG_DIR: dir, PG_PORT: String(port), PG_DB: database };
  await cluster(env, 'destroy');
  await cluster(env, 'start');
  return {
    dir,
    port,
    database,
    url: await cluster(env, 'url'),
    superuserUrl: await cluster(env, 'superuser-url'),
    env,
    start: async () => void (await cluster(env, 'start')),
    stop: async () => void (await cluster(env, 'stop')),
    destroy: async () => void (await cluster(env, 'destroy')),
  };
}

/** What `npm start` does to an empty database: migrations, built-in rule sets, the mail queues. */
export async function prepareDatabase(url: string): Promise<void> {
  const sequelize = createSequelize(url, { poolMax: 2 });
  initModels(sequelize);
  try {
    await migrateUp(sequelize);
    await ensureBuiltInRuleSets(sequelize);
  } finally {
    await sequelize.close();
  }
  const boss = await startMailQueue(url);
  await boss.stop({ graceful: false, wait: true, timeout: 2000 } as never);
}
