/**
 * Outgoing mail goes through a job queue in PostgreSQL (pg-boss), so a mail server that is down
 * delays mail but loses none. Jobs are enqueued inside the caller's transaction: a rolled-back
 * change sends nothing. Delivery is at least once (pg-boss re-delivers an expired job).
 */
import PgBoss from 'pg-boss';
import type { Transaction } from 'sequelize';
import type { Mailer, OutgoingMail } from './mailer';

export const MAIL_QUEUE = 'mail';
const MAIL_DEAD_LETTER = 'mail-failed';

/** Retry `fn` when PostgreSQL aborts it with a deadlock or a duplicate (queue creation racing another process). */
export async function retryOnDeadlock<T>(fn: () => Promise<T>, attempts = 5): Promise<T> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await fn();
    } catch (error) {
      const code = (error as { code?: string }).code;
      if ((code !== '40P01' && code !== '23505') || attempt >= attempts) throw error;
      await new Promise((resolve) => setTimeout(resolve, 50 * attempt + Math.random() * 100));
    }
  }
}

export async function startMailQueue(databaseUrl: string, options: { retryDelaySeconds?: number } = {}) {
  const boss = new PgBoss({ connectionString: databaseUrl, application_name: 'sidecheck-jobs', max: 4 });
  boss.on('error', (error) => console.error(JSON.stringify({ level: 'error', msg: 'job queue error', error: String(error) })));
  await boss.start();
  // Several processes (API servers, parallel test workers) may create the queues at once on a
  // fresh database; PostgreSQL then aborts one of them with a deadlock, which is safe to retry.
  await retryOnDeadlock(() => boss.createQueue(MAIL_DEAD_LETTER, { name: MAIL_DEAD_LETTER }));
  await retryOnDeadlock(() => boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: 20,
    retryDelay: options.retryDelaySeconds ?? 5,
    retryBackoff: true,
    expireInSeconds: 120,
    deadLetter: MAIL_DEAD_LETTER,
  }));
  return boss;
}

/**
 * Enqueue within a Sequelize transaction, so the mail exists exactly when the change commits.
 * `retryDelaySeconds` sets the job's first retry delay (the queue's, 5 s, when absent); a job's
 * own setting wins over the queue's, so it applies to a queue created earlier too.
 */
export async function enqueueMail(boss: PgBoss, transaction: Transaction | null, mail: OutgoingMail, options: { retryDelaySeconds?: number } = {}): Promise<void> {
  // pg-boss runs its INSERT on the transaction's own connection (pg's numbered parameters go to
  // pg unchanged), so the job commits or rolls back with the change that caused it.
  const connection = (transaction as unknown as { connection?: { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> } } | null)?.connection;
  const db = connection ? { executeSql: (text: string, values: unknown[]) => connection.query(text, values) } : undefined;
  const retry = options.retryDelaySeconds === undefined ? {} : { retryDelay: options.retryDelaySeconds };
  await boss.send(MAIL_QUEUE, mail as unknown as object, { ...retry, ...(db ? { db } : {}) });
}

export async function startMailWorker(boss: PgBoss, mailer: Mailer): Promise<string> {
  return boss.work<OutgoingMail>(MAIL_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async (jobs) => {
    for (const job of jobs) await mailer.send(job.data);
  });
}
