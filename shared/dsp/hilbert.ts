import { requireArrayLike } from '../units/number-guards';
import { anyLengthDft } from './any-length-dft';

/** Complex samples as two parallel arrays: in-phase (real) and quadrature (imaginary) parts. */
export interface ComplexSamples<T extends Float32Array | Float64Array = Float64Array> {
  i: T;
  q: T;
}

/**
 * Analytic signal z = x + j·H{x} of a real sequence by the FFT method: X = DFT(x), then
 * Z[k] = X[k]·h[k] with h[0] = 1, h[k] = 2 for 0 < k < N/2, h[N/2] = 1 (even N), h[k] = 0
 * above; z = IDFT(Z). Its spectrum is one-sided (positive frequencies only), i.e. an ideal
 * Hilbert transformer H(f) = −j·sgn(f) applied to the periodic extension of x.
 *
 * Source: scipy.signal.hilbert (same h[k]; Marple, "Computing the discrete-time analytic
 * signal via FFT", IEEE Trans. Signal Process. 47(9), 1999); check vector
 * analytic([1, 2, 3, 4]) = [1+1j, 2−1j, 3−1j, 4+1j] from the SciPy documentation.
 * Any length N ≥ 1 is handled exactly: power-of-two lengths by fft.js, others by Bluestein's
 * algorithm ({@link anyLengthDft}); zero padding is not used because it would change the
 * result. The real part returned is x itself.
 * Units: those of x. Domain: a non-empty array of finite numbers.
 * Bad input: TypeError for a non-array, RangeError for an empty or non-finite input, starting
 * with "analyticSignal".
 *
 * @example analyticSignal([1, 2, 3, 4]); // { i: [1, 2, 3, 4], q: [1, -1, -1, 1] }
 */
export function analyticSignal(x: ArrayLike<number>): ComplexSamples {
  return analytic('analyticSignal', x);
}

function analytic(fn: string, x: ArrayLike<number>): ComplexSamples {
  requireArrayLike(fn, 'x', x);
  const n = x.length;
  if (n === 0) throw new RangeError(`${fn}: x is empty`);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    if (!Number.isFinite(x[k])) throw new RangeError(`${fn}: x[${k}] is not finite`);
    re[k] = x[k];
  }
  anyLengthDft(re, im, 'forward');
  const half = Math.floor(n / 2);
  for (let k = 1; k < n; k++) {
    const h = n % 2 === 0 ? (k < half ? 2 : k === half ? 1 : 0) : k <= half ? 2 : 0;
    re[k] *= h;
    im[k] *= h;
  }
  anyLengthDft(re, im, 'inverse');
  return { i: Float64Array.from(x), q: im };
}

/**
 * Complex baseband (IQ) of a real audio or IF recording, as a phasing SSB modulator with an
 * ideal Hilbert transformer would make it: 'usb' keeps the positive frequencies
 * (q = H{x}), 'lsb' mirrors them to negative ones (q = −H{x}). Float32 out, as capture files.
 *
 * Source: as {@link analyticSignal}; LSB is the complex conjugate of the USB signal
 * (phasing-method SSB, common practice). Whole-record transform (not streaming): memory as
 * {@link anyLengthDft}, about 100–200 bytes per sample for non-power-of-two lengths.
 * Bad input: as analyticSignal, with messages starting with "realToIq"; sideband other than
 * 'usb' or 'lsb' → RangeError.
 *
 * @example realToIq([1, 2, 3, 4], 'lsb'); // { i: [1, 2, 3, 4], q: [-1, 1, 1, -1] }
 */
export function realToIq(
  x: ArrayLike<number>,
  sideband: 'usb' | 'lsb' = 'usb',
): ComplexSamples<Float32Array> {
  if (sideband !== 'usb' && sideband !== 'lsb') {
    throw new RangeError(`realToIq: sideband must be 'usb' or 'lsb', got ${String(sideband)}`);
  }
  const z = analytic('realToIq', x);
  const q = new Float32Array(z.q.length);
  const sign = sideband === 'usb' ? 1 : -1;
  for (let k = 0; k < q.length; k++) q[k] = sign * z.q[k];
  return { i: Float32Array.from(z.i), q };
}
