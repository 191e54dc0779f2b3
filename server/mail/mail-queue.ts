/**
 * Outgoing mail goes through a job queue in PostgreSQL (pg-boss), so a mail server that is down
 * delays mail but loses none. Jobs are enqueued inside the caller's transaction: a rolled-back
 * change sends nothing. Delivery is at least once (pg-boss re-delivers an expired job).
 */
import PgBoss from 'pg-boss';
import type { Sequelize, Transaction } from 'sequelize';
import type { Mailer, OutgoingMail } from './mailer';

export const MAIL_QUEUE = 'mail';
const MAIL_DEAD_LETTER = 'mail-failed';

export async function startMailQueue(databaseUrl: string, options: { retryDelaySeconds?: number } = {}) {
  const boss = new PgBoss({ connectionString: databaseUrl, application_name: 'sidecheck-jobs', max: 4 });
  boss.on('error', (error) => console.error(JSON.stringify({ level: 'error', msg: 'job queue error', error: String(error) })));
  await boss.start();
  await boss.createQueue(MAIL_DEAD_LETTER, { name: MAIL_DEAD_LETTER });
  await boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: 20,
    retryDelay: options.retryDelaySeconds ?? 5,
    retryBackoff: true,
    expireInSeconds: 120,
    deadLetter: MAIL_DEAD_LETTER,
  });
  return boss;
}

/** Enqueue within a Sequelize transaction, so the mail exists exactly when the change commits. */
export async function enqueueMail(boss: PgBoss, sequelize: Sequelize, transaction: Transaction | null, mail: OutgoingMail): Promise<void> {
  const db = {
    executeSql: async (text: string, values: unknown[]) => {
      const [rows] = await sequelize.query(text, { bind: values, transaction: transaction ?? undefined });
      return { rows: rows as unknown[] };
    },
  };
  await boss.send(MAIL_QUEUE, mail as unknown as object, { db });
}

export async function startMailWorker(boss: PgBoss, mailer: Mailer): Promise<string> {
  return boss.work<OutgoingMail>(MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await mailer.send(job.data);
  });
}
