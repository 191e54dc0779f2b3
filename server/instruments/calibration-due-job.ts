/**
 * The calibration check as a pg-boss scheduled job: once a day (05:15 UTC by default) any one
 * API process runs checkCalibrationDue. pg-boss keeps one schedule per queue name in the
 * database, so several processes scheduling it still run it once; the check itself is idempotent
 * for the rare repeated delivery.
 */
import type PgBoss from 'pg-boss';
import { retryOnDeadlock } from '../mail/mail-queue';
import { checkCalibrationDue, type CalibrationNoticeDeps } from './calibration-due-notices';

export const CALIBRATION_CHECK_QUEUE = 'calibration-due-check';
/** Daily, before the working day in Europe (cron, UTC). */
export const CALIBRATION_CHECK_CRON = '15 5 * * *';

export async function startCalibrationDueJob(boss: PgBoss, deps: CalibrationNoticeDeps, options: { cron?: string } = {}): Promise<string> {
  await retryOnDeadlock(() => boss.createQueue(CALIBRATION_CHECK_QUEUE, { name: CALIBRATION_CHECK_QUEUE, retryLimit: 3, retryDelay: 300, expireInSeconds: 600 }));
  await retryOnDeadlock(() => boss.schedule(CALIBRATION_CHECK_QUEUE, options.cron ?? CALIBRATION_CHECK_CRON, {}, { tz: 'UTC' }));
  return boss.work(CALIBRATION_CHECK_QUEUE, { batchSize: 1 }, async () => {
    const outcome = await checkCalibrationDue(deps);
    console.log(JSON.stringify({ level: 'info', msg: 'calibration check', ...outcome }));
  });
}
