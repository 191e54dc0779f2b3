import { requireArrayLike } from '../units/number-guards';

/** Figures of merit of a window of length N (Harris 1978 definitions). */
export interface WindowMetrics {
  length: number;
  /** Σ w[n] */
  sum: number;
  /** Σ w[n]² — the density-scaling denominator of a Welch PSD (with fs). */
  sumOfSquares: number;
  /** Coherent gain Σw/N: the amplitude gain for a tone centred on a bin. */
  coherentGain: number;
  /** Equivalent noise bandwidth in bins, N·Σw²/(Σw)². Multiply by fs/N for hertz. */
  enbwBins: number;
  /**
   * Response to a tone half a bin off centre relative to a centred one, in dB (negative):
   * 20·log10(|Σ w[n]·e^(−jπn/N)| / Σw). Harris's "scallop loss" is its magnitude.
   */
  halfBinResponseDb: number;
}

/**
 * Coherent gain, sum of squares, equivalent noise bandwidth and half-bin scalloping of a window.
 *
 * Source: F. J. Harris, Proc. IEEE 66(1), 1978, §IV (coherent gain, ENBW, scallop loss);
 * reference values there: Hann CG 0.50, ENBW 1.50 bins, scallop loss 1.42 dB; 4-term −92 dB
 * Blackman–Harris CG 0.36, ENBW 2.00 bins, scallop loss 0.83 dB.
 * Units: dimensionless, bins, dB. Domain: a non-empty array of finite values with Σw > 0.
 * Bad input: TypeError for a non-array, RangeError otherwise, starting with "windowMetrics".
 *
 * @example windowMetrics(windowCoefficients('hann', 1024)).enbwBins; // 1.5
 */
export function windowMetrics(window: ArrayLike<number>): WindowMetrics {
  const fn = 'windowMetrics';
  const w = requireArrayLike(fn, 'window', window);
  const n = w.length;
  if (n === 0) throw new RangeError(`${fn}: the window is empty`);
  let sum = 0;
  let sumOfSquares = 0;
  let halfRe = 0;
  let halfIm = 0;
  for (let k = 0; k < n; k++) {
    const v = w[k];
    if (!Number.isFinite(v)) throw new RangeError(`${fn}: window[${k}] is not finite`);
    sum += v;
    sumOfSquares += v * v;
    const angle = (Math.PI * k) / n;
    halfRe += v * Math.cos(angle);
    halfIm -= v * Math.sin(angle);
  }
  if (!(sum > 0)) throw new RangeError(`${fn}: the window must have a positive sum`);
  return {
    length: n,
    sum,
    sumOfSquares,
    coherentGain: sum / n,
    enbwBins: (n * sumOfSquares) / (sum * sum),
    halfBinResponseDb: 20 * Math.log10(Math.hypot(halfRe, halfIm) / sum),
  };
}
