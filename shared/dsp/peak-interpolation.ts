/** How a spectral peak's frequency is refined between bins. */
export type PeakInterpolation = 'none' | 'parabolic' | 'gaussian';

/**
 * Fractional offset δ (in bins, −0.5 … 0.5) of a spectral peak from bin k, from the peak bin
 * and its two neighbours a = y[k−1], b = y[k], c = y[k+1]:
 *
 *   δ = ½·(a − c) / (a − 2b + c)
 *
 * with y the power values ('parabolic') or their natural logarithms ('gaussian', exact for a
 * Gaussian-shaped lobe and within a few hundredths of a bin for Hann). 'none' gives 0.
 *
 * Source: quadratic peak interpolation (J. O. Smith, "Spectral Audio Signal Processing", 2011,
 * "Quadratic Interpolation of Spectral Peaks"; the log-domain form is Gaussian interpolation).
 * Domain: b ≥ a, b ≥ c (a peak), all ≥ 0. A flat top, a zero neighbour in the log form, or any
 * non-finite value gives 0 (no refinement rather than a wild value); the result is clamped to
 * ±0.5 bin.
 *
 * @example peakOffsetBins(1, 4, 1, 'parabolic'); // 0
 */
export function peakOffsetBins(a: number, b: number, c: number, method: PeakInterpolation): number {
  if (method === 'none') return 0;
  let ya = a;
  let yb = b;
  let yc = c;
  if (method === 'gaussian') {
    if (!(a > 0 && b > 0 && c > 0)) return 0;
    ya = Math.log(a);
    yb = Math.log(b);
    yc = Math.log(c);
  }
  const denominator = ya - 2 * yb + yc;
  if (!(denominator < 0) || !Number.isFinite(denominator)) return 0;
  const delta = (0.5 * (ya - yc)) / denominator;
  return Math.max(-0.5, Math.min(0.5, delta));
}
