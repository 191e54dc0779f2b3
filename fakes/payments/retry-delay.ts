/**
 * Delay before the next webhook delivery attempt: exponential backoff, doubling from a base and
 * capped, delay = min(cap, base · 2^(failures − 1)). Deterministic (no jitter), so specs and
 * the deliveries listing can predict the schedule.
 *
 * @param failures - failed attempts so far, an integer ≥ 1.
 * @param settings.retryBaseMs - delay after the first failure, ms (> 0).
 * @param settings.retryCapMs - largest delay, ms (≥ base).
 * @returns the delay in ms.
 * @throws RangeError "retryDelayMs: …" for failures < 1, a non-positive base or cap < base.
 * @example retryDelayMs(3, { retryBaseMs: 1000, retryCapMs: 300000 }) === 4000
 */
export function retryDelayMs(
  failures: number,
  settings: { retryBaseMs: number; retryCapMs: number },
): number {
  const { retryBaseMs, retryCapMs } = settings;
  if (!Number.isInteger(failures) || failures < 1) {
    throw new RangeError(`retryDelayMs: failures must be an integer >= 1, got ${failures}`);
  }
  if (!(retryBaseMs > 0) || !(retryCapMs >= retryBaseMs)) {
    throw new RangeError(`retryDelayMs: need 0 < base <= cap, got ${retryBaseMs}, ${retryCapMs}`);
  }
  // The exponent is bounded so 2^n stays finite for very long outages.
  return Math.min(retryCapMs, retryBaseMs * 2 ** Math.min(failures - 1, 40));
}
