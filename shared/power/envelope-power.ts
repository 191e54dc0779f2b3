import { CompensatedSum } from '../units/compensated-sum';
import { requireArrayLike } from '../units/number-guards';

/**
 * Powers of a complex baseband envelope x[n] = i[n] + j·q[n], in the units of the samples
 * squared (linear; V² for volts, or full-scale² for normalized IQ). Divide by R or apply the
 * calibration factor to get watts.
 *
 * Source: PEP is the mean power over one RF cycle at the envelope crest (ITU RR 1.157), which
 * for a complex envelope is max |x|²; mean power (RR 1.158) is the average of |x|² over the
 * record. The record should span many modulation cycles for the mean to be meaningful.
 *
 * Policy: i and q must be array-likes of equal, non-zero length of finite numbers; otherwise a
 * RangeError (TypeError for non-arrays) whose message starts with the function's name.
 */
function checkEnvelope(fnName: string, i: ArrayLike<number>, q: ArrayLike<number>): void {
  requireArrayLike(fnName, 'i', i);
  requireArrayLike(fnName, 'q', q);
  if (i.length !== q.length) {
    throw new RangeError(`${fnName}: i and q lengths differ (${i.length} vs ${q.length})`);
  }
  if (i.length === 0) throw new RangeError(`${fnName}: the envelope is empty`);
}

function nonFinite(fnName: string, index: number): RangeError {
  return new RangeError(`${fnName}: sample ${index} is not finite`);
}

/**
 * Peak envelope power: max over n of i[n]² + q[n]².
 * @example pepFromEnvelope([1, 0, -2], [0, 1, 0]); // 4
 */
export function pepFromEnvelope(i: ArrayLike<number>, q: ArrayLike<number>): number {
  checkEnvelope('pepFromEnvelope', i, q);
  let peak = 0;
  for (let n = 0; n < i.length; n++) {
    const p = i[n] * i[n] + q[n] * q[n];
    if (!Number.isFinite(p)) throw nonFinite('pepFromEnvelope', n);
    if (p > peak) peak = p;
  }
  return peak;
}

/**
 * Mean envelope power: (1/N) Σ (i[n]² + q[n]²), summed with Neumaier compensation.
 * @example meanPowerFromEnvelope([1, 0, -2], [0, 1, 0]); // 2
 */
export function meanPowerFromEnvelope(i: ArrayLike<number>, q: ArrayLike<number>): number {
  checkEnvelope('meanPowerFromEnvelope', i, q);
  const acc = new CompensatedSum();
  for (let n = 0; n < i.length; n++) {
    const p = i[n] * i[n] + q[n] * q[n];
    if (!Number.isFinite(p)) throw nonFinite('meanPowerFromEnvelope', n);
    acc.add(p);
  }
  return acc.value / i.length;
}
