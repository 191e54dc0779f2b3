/**
 * Axis ticks on "nice" numbers: steps of 1, 2 or 5 times a power of ten, after P. S. Heckbert,
 * "Nice numbers for graph labels", Graphics Gems (1990): the raw step (range / target count) is
 * rounded to 1 below 1.5, 2 below 3, 5 below 7, else 10 (times its power of ten), and the axis
 * is widened outwards to whole steps ("loose" labelling).
 */

export interface AxisTicks {
  /** Axis start and end, whole multiples of the step, enclosing the data. */
  lo: number;
  hi: number;
  step: number;
  /** Tick positions from lo to hi inclusive, rounded to the step's decimals. */
  ticks: number[];
  /** Decimals needed to print a tick without losing its value. */
  decimals: number;
}

/**
 * Ticks for data from `min` to `max` with about `targetCount` intervals (default 5).
 * Equal min and max widen to a unit around the value. Non-finite bounds, min > max or a target
 * count below 1 throw a RangeError.
 * @example niceTicks(-3, 47)
 *   // { lo: -10, hi: 50, step: 10, ticks: [-10, 0, 10, 20, 30, 40, 50], decimals: 0 }
 */
export function niceTicks(min: number, max: number, targetCount = 5): AxisTicks {
  if (!Number.isFinite(min) || !Number.isFinite(max) || min > max) {
    throw new RangeError(`niceTicks: need finite min <= max, got ${min} and ${max}`);
  }
  if (!(targetCount >= 1)) {
    throw new RangeError(`niceTicks: targetCount must be >= 1, got ${targetCount}`);
  }
  if (min === max) {
    const half = min === 0 ? 1 : Math.abs(min) * 0.1;
    return niceTicks(min - half, max + half, targetCount);
  }
  const raw = (max - min) / targetCount;
  const power = Math.floor(Math.log10(raw));
  const magnitude = 10 ** power;
  const normalised = raw / magnitude;
  const nice = normalised < 1.5 ? 1 : normalised < 3 ? 2 : normalised < 7 ? 5 : 10;
  const step = nice * magnitude;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const round = (v: number) => Number(v.toFixed(decimals));
  // A tiny tolerance keeps a bound that sits on a step (to rounding error) from adding one more.
  const lo = round(Math.floor(min / step + 1e-9) * step);
  const hi = round(Math.ceil(max / step - 1e-9) * step);
  const count = Math.round((hi - lo) / step);
  const ticks = Array.from({ length: count + 1 }, (_, i) => round(lo + i * step));
  return { lo, hi, step: round(step) || step, ticks, decimals };
}
