import { tooManyRequests } from '../http/problem';

/**
 * How many pre-checks one person may start per hour: a sliding window kept in this process's
 * memory (a pre-check is engineering help, not a record, so a restart forgetting the count is
 * acceptable). Counted when a pre-check starts, so refused and oversized attempts count too.
 */
export function createPrecheckLimiter(perHour: number, now: () => number = Date.now) {
  const windowMs = 3600_000;
  const started = new Map<string, number[]>();
  return {
    /** Records an attempt, or throws 429 with Retry-After when the person has used the hour's allowance. */
    take(who: string): void {
      const t = now();
      const recent = (started.get(who) ?? []).filter((at) => t - at < windowMs);
      if (recent.length >= perHour) {
        const retryAfterSeconds = Math.max(1, Math.ceil((recent[0] + windowMs - t) / 1000));
        throw tooManyRequests(`You can run ${perHour} pre-checks an hour; try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`, retryAfterSeconds);
      }
      recent.push(t);
      started.set(who, recent);
    },
  };
}
