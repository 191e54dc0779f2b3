import { CompensatedSum } from '../units/compensated-sum';
import { requireArrayLike, requireLevelDb } from '../units/number-guards';

/** Limits of a bandwidth and its width, Hz. */
export interface BandLimits {
  lowerHz: number;
  upperHz: number;
  bandwidthHz: number;
}

/** Options for the occupied-bandwidth calculation. */
export interface OccupiedBandwidthOptions {
  /** Fraction of the total power inside the band, 0 < fraction < 1; default 0.99 (β/2 = 0.5 %). */
  fraction?: number;
}

function checkBins(fn: string, f: ArrayLike<number>, p: ArrayLike<number>): void {
  requireArrayLike(fn, 'frequencyHz', f);
  requireArrayLike(fn, 'power', p);
  if (f.length !== p.length) {
    throw new RangeError(`${fn}: array lengths differ (${f.length} vs ${p.length})`);
  }
  if (f.length < 2) throw new RangeError(`${fn}: need at least two bins to know their width`);
  for (let i = 0; i < f.length; i++) {
    if (!Number.isFinite(f[i]) || (i > 0 && !(f[i] > f[i - 1]))) {
      throw new RangeError(`${fn}: frequencyHz must be finite and strictly ascending (index ${i})`);
    }
  }
}

/** Lower edge of bin i: midway to the neighbour; the end bins extend by half their spacing. */
function lowerEdgeHz(f: ArrayLike<number>, i: number): number {
  return i === 0 ? f[0] - (f[1] - f[0]) / 2 : (f[i - 1] + f[i]) / 2;
}

function upperEdgeHz(f: ArrayLike<number>, i: number): number {
  const n = f.length;
  return i === n - 1 ? f[n - 1] + (f[n - 1] - f[n - 2]) / 2 : (f[i] + f[i + 1]) / 2;
}

/**
 * Occupied bandwidth from per-bin powers: the band outside whose lower and upper limits lie
 * (1 − fraction)/2 of the total mean power each (0.5 % each by default, β/2 of RR 1.153).
 * Bins are ascending; each bin's power is taken as spread uniformly across its width (edges
 * midway between bin centres), so the crossings are interpolated within a bin. The cumulative
 * sums are compensated, and the upper limit is found from the top so the method is symmetric.
 *
 * Source: ITU RR 1.153 definition of occupied bandwidth (0.5 % figure from memory); algorithm
 * common practice. A flat band 300–2700 Hz gives 0.99 × 2400 = 2376 Hz.
 * Units: Hz; power in any linear unit (the result does not change when all powers are scaled).
 * Domain: ≥ 2 bins, frequencies finite and strictly ascending, powers finite and ≥ 0 with a
 * positive total, 0 < fraction < 1.
 * Bad input: RangeError (TypeError for non-arrays) starting with the function name.
 *
 * @example
 * occupiedBandwidthFromPowers([250, 750, 1250, 1750], [0, 1, 1, 0]);
 * // { lowerHz: 505, upperHz: 1495, bandwidthHz: 990 }
 */
export function occupiedBandwidthFromPowers(
  frequencyHz: ArrayLike<number>,
  powerLinear: ArrayLike<number>,
  options?: OccupiedBandwidthOptions,
): BandLimits {
  const fn = 'occupiedBandwidthFromPowers';
  checkBins(fn, frequencyHz, powerLinear);
  const fraction = options?.fraction ?? 0.99;
  if (typeof fraction !== 'number' || !(fraction > 0 && fraction < 1)) {
    throw new RangeError(
      `${fn}: fraction must be between 0 and 1 (exclusive), got ${String(fraction)}`,
    );
  }
  const f = frequencyHz;
  const p = powerLinear;
  const n = p.length;
  const total = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(p[i]) || p[i] < 0) {
      throw new RangeError(`${fn}: power[${i}] must be finite and ≥ 0, got ${p[i]}`);
    }
    total.add(p[i]);
  }
  if (!(total.value > 0)) throw new RangeError(`${fn}: the total power is zero`);
  const tail = ((1 - fraction) / 2) * total.value;

  let lowerHz = NaN;
  const below = new CompensatedSum();
  for (let i = 0; i < n; i++) {
    const before = below.value;
    below.add(p[i]);
    if (p[i] > 0 && below.value >= tail) {
      const lo = lowerEdgeHz(f, i);
      lowerHz = lo + ((tail - before) / p[i]) * (upperEdgeHz(f, i) - lo);
      break;
    }
  }
  let upperHz = NaN;
  const above = new CompensatedSum();
  for (let i = n - 1; i >= 0; i--) {
    const before = above.value;
    above.add(p[i]);
    if (p[i] > 0 && above.value >= tail) {
      const hi = upperEdgeHz(f, i);
      upperHz = hi - ((tail - before) / p[i]) * (hi - lowerEdgeHz(f, i));
      break;
    }
  }
  return { lowerHz, upperHz, bandwidthHz: upperHz - lowerHz };
}

/**
 * Occupied bandwidth from a trace in dBm per bin (RMS detector, bins no wider than the RBW):
 * converts to linear power relative to the highest bin, then applies
 * {@link occupiedBandwidthFromPowers}. -Infinity dBm bins carry no power.
 * Bad input: as occupiedBandwidthFromPowers; NaN or +Infinity levels → RangeError.
 *
 * @example occupiedBandwidthFromTrace([250, 750, 1250, 1750], [-Infinity, 0, 0, -Infinity]);
 * // { lowerHz: 505, upperHz: 1495, bandwidthHz: 990 }
 */
export function occupiedBandwidthFromTrace(
  frequencyHz: ArrayLike<number>,
  levelDbm: ArrayLike<number>,
  options?: OccupiedBandwidthOptions,
): BandLimits {
  const fn = 'occupiedBandwidthFromTrace';
  const levels = requireArrayLike(fn, 'levelDbm', levelDbm);
  const n = levels.length;
  let maxDbm = -Infinity;
  for (let i = 0; i < n; i++) {
    const v = levels[i];
    // The guard builds its message only for a bad value: no string work per point (hot loop).
    if (typeof v !== 'number' || (!(v < Infinity) && v !== -Infinity)) requireLevelDb(fn, `levelDbm[${i}]`, v);
    if (v > maxDbm) maxDbm = v;
  }
  if (maxDbm === -Infinity) throw new RangeError(`${fn}: the trace holds no power`);
  // Relative to the top bin so levels far from 0 dBm neither overflow nor underflow;
  // 10^(x/10) as exp(x·ln10/10), the same value, cheaper.
  const power = new Float64Array(n);
  const k = Math.LN10 / 10;
  for (let i = 0; i < n; i++) power[i] = Math.exp((levels[i] - maxDbm) * k);
  return occupiedBandwidthFromPowers(frequencyHz, power, options);
}
