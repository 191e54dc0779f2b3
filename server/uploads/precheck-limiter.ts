import { QueryTypes, type Sequelize } from 'sequelize';
import { tooManyRequests } from '../http/problem';

/** The sliding window of the pre-check allowance. */
export const PRECHECK_WINDOW_SECONDS = 3600;

/**
 * How many pre-checks one person may start per hour: a sliding window counted in PostgreSQL
 * (table precheck_starts, migration 0009), so every API process shares the allowance, as
 * sign-in failures are shared (server/accounts/sign-in-limiter.ts). Counted when a pre-check
 * starts, so refused and oversized attempts count too. A transaction-scoped advisory lock per
 * person makes the count and the insert one step, so two processes cannot both take the last
 * start. A person's starts older than the window are removed when they start another.
 */
export function createPrecheckLimiter(sequelize: Sequelize, perHour: number) {
  return {
    /** Records an attempt, or throws 429 with Retry-After when the person has used the hour's allowance. */
    async take(who: string): Promise<void> {
      await sequelize.transaction(async (transaction) => {
        const q = <T extends object>(sql: string) =>
          sequelize.query<T>(sql, { replacements: { who, window: PRECHECK_WINDOW_SECONDS, perHour }, type: QueryTypes.SELECT, transaction });
        await q("SELECT pg_advisory_xact_lock(hashtextextended('precheck:' || :who, 0))");
        const [recent] = await q<{ n: string; wait: string | null }>(
          `SELECT count(*) AS n, ceil(extract(epoch FROM min(started_at) + make_interval(secs => :window) - now())) AS wait
             FROM precheck_starts WHERE user_id = :who AND started_at > now() - make_interval(secs => :window)`,
        );
        if (Number(recent.n) >= perHour) {
          const retryAfterSeconds = Math.max(1, Number(recent.wait));
          throw tooManyRequests(`You can run ${perHour} pre-checks an hour; try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`, retryAfterSeconds);
        }
        await sequelize.query(
          `DELETE FROM precheck_starts WHERE user_id = :who AND started_at <= now() - make_interval(secs => :window);
           INSERT INTO precheck_starts (user_id) VALUES (:who);`,
          { replacements: { who, window: PRECHECK_WINDOW_SECONDS }, transaction },
        );
      });
    },
  };
}
