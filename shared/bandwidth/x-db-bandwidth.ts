import { requireArrayLike, requireLevelDb, requirePositive } from '../units/number-guards';
import type { BandLimits } from './occupied-bandwidth';

/** x-dB bandwidth limits together with the peak they are measured from. */
export interface XDbBandwidth extends BandLimits {
  peakHz: number;
  peakDb: number;
}

/** Frequency where the level crosses `threshold` between points j (≤ threshold) and k (>). */
function crossingHz(
  f: ArrayLike<number>,
  l: ArrayLike<number>,
  j: number,
  k: number,
  threshold: number,
): number {
  // From -Infinity dB the linear-in-dB line reaches the threshold only at the inner point.
  if (l[j] === -Infinity) return f[k];
  return f[j] + ((threshold - l[j]) / (l[k] - l[j])) * (f[k] - f[j]);
}

/**
 * x-dB bandwidth: the width between the outermost points where the spectrum is still more than
 * x dB below its peak — beyond the limits every component is attenuated by at least x dB. Each
 * limit is interpolated linearly in dB over Hz between the last point at or below peak − x and
 * the first point above it.
 *
 * Source: ITU-R SM.328 §1.8 definition of x-dB bandwidth (published); measurement as in
 * ITU-R SM.443. Units: Hz, dB (any consistent reference). Domain: equal-length arrays, ≥ 2
 * points, frequencies finite and strictly ascending, levels below +Infinity, a finite peak,
 * xDb > 0, and the trace must fall to peak − x on both sides of the peak.
 * Bad input: RangeError (TypeError for non-arrays) starting with the function name.
 *
 * @example xDbBandwidth([0, 1000, 2000, 3000, 4000], [-60, -20, 0, -20, -60], 26);
 * // { lowerHz: 850, upperHz: 3150, bandwidthHz: 2300, peakHz: 2000, peakDb: 0 }
 */
export function xDbBandwidth(
  frequencyHz: ArrayLike<number>,
  levelDb: ArrayLike<number>,
  xDb: number,
): XDbBandwidth {
  const fn = 'xDbBandwidth';
  const f = requireArrayLike(fn, 'frequencyHz', frequencyHz);
  const l = requireArrayLike(fn, 'levelDb', levelDb);
  const x = requirePositive(fn, 'xDb', xDb);
  if (f.length !== l.length) {
    throw new RangeError(`${fn}: array lengths differ (${f.length} vs ${l.length})`);
  }
  if (f.length < 2) throw new RangeError(`${fn}: need at least two points`);
  let peak = 0;
  for (let i = 0; i < f.length; i++) {
    if (!Number.isFinite(f[i]) || (i > 0 && !(f[i] > f[i - 1]))) {
      throw new RangeError(`${fn}: frequencyHz must be finite and strictly ascending (index ${i})`);
    }
    if (requireLevelDb(fn, `levelDb[${i}]`, l[i]) > l[peak]) peak = i;
  }
  if (l[peak] === -Infinity) throw new RangeError(`${fn}: the trace holds no power`);
  const threshold = l[peak] - x;
  let lo = 0;
  while (!(l[lo] > threshold)) lo++;
  let hi = f.length - 1;
  while (!(l[hi] > threshold)) hi--;
  if (lo === 0 || hi === f.length - 1) {
    throw new RangeError(`${fn}: the trace does not fall ${x} dB below the peak on both sides`);
  }
  const lowerHz = crossingHz(f, l, lo - 1, lo, threshold);
  const upperHz = crossingHz(f, l, hi + 1, hi, threshold);
  return { lowerHz, upperHz, bandwidthHz: upperHz - lowerHz, peakHz: f[peak], peakDb: l[peak] };
}
