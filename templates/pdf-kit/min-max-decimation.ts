/**
 * Thins a long trace for drawing without losing its peaks: the x range is cut into `bucketCount`
 * equal buckets and each bucket keeps its first, lowest and highest point (in x order), so the
 * drawn envelope matches the full trace at plot resolution. Common practice for plotting
 * spectrum-analyser traces; a limit check must never run on the thinned data.
 */

export interface XyPoints {
  x: number[];
  y: number[];
}

/**
 * Returns the points to draw. Traces with at most `3 * bucketCount` points come back unchanged
 * (copied). Non-finite y values are kept as gaps (one NaN per bucket that had one). x must be
 * ascending. Throws a RangeError for unequal lengths or a bucket count below 1.
 * @example decimateMinMax([0, 1, 2, 3, 4, 5, 6], [0, 5, 1, 1, 9, 0, 2], 1)
 *   // { x: [0, 4], y: [0, 9] } (the first point is also the lowest, then the highest)
 */
export function decimateMinMax(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  bucketCount: number,
): XyPoints {
  if (x.length !== y.length) {
    throw new RangeError(`decimateMinMax: x has ${x.length} points, y has ${y.length}`);
  }
  if (!(bucketCount >= 1)) {
    throw new RangeError(`decimateMinMax: bucketCount must be >= 1, got ${bucketCount}`);
  }
  const n = x.length;
  if (n <= 3 * bucketCount) return { x: Array.from(x), y: Array.from(y) };
  const x0 = x[0];
  const span = x[n - 1] - x0 || 1;
  const out: XyPoints = { x: [], y: [] };
  const keep = (k: number) => {
    out.x.push(x[k]);
    out.y.push(y[k]);
  };
  const bucketOf = (k: number) =>
    Math.min(bucketCount - 1, Math.floor(((x[k] - x0) / span) * bucketCount));
  let i = 0;
  while (i < n) {
    const bucket = bucketOf(i);
    const first = i;
    let lo = -1;
    let hi = -1;
    let gap = false;
    for (; i < n && bucketOf(i) === bucket; i++) {
      const v = y[i];
      if (!Number.isFinite(v)) {
        gap = true;
        continue;
      }
      if (lo < 0 || v < y[lo]) lo = i;
      if (hi < 0 || v > y[hi]) hi = i;
    }
    // first (when it is a value), lowest and highest, each once, in x order: without arrays,
    // since a long trace has thousands of buckets.
    let a = Number.isFinite(y[first]) ? first : -1;
    let b = lo;
    let c = hi;
    if (a > b) [a, b] = [b, a];
    if (b > c) [b, c] = [c, b];
    if (a > b) [a, b] = [b, a];
    if (a >= 0) keep(a);
    if (b >= 0 && b !== a) keep(b);
    if (c >= 0 && c !== b) keep(c);
    if (gap) {
      out.x.push(x[i - 1]);
      out.y.push(Number.NaN);
    }
  }
  return out;
}
