/** Names of the spectral-analysis windows offered (the names scipy.signal.get_window uses). */
export type WindowName = 'hann' | 'flattop' | 'blackmanharris';

/**
 * Cosine-sum coefficients a₀…a_K of each window, w[n] = Σₖ (−1)ᵏ·aₖ·cos(2πkn/N).
 *
 * Sources:
 * - hann: a = [0.5, 0.5] (F. J. Harris, "On the use of windows for harmonic analysis with the
 *   discrete Fourier transform", Proc. IEEE 66(1), 1978, Hanning window).
 * - flattop: the 5-term flat-top of G. D'Antona and A. Ferrero, "Digital Signal Processing for
 *   Measurement Systems", Springer 2006, p. 70 — the coefficients MATLAB's flattopwin and
 *   scipy.signal.windows.flattop publish. Chosen over the HFT/SRS family because labs compare
 *   against those two tools; its main lobe is flat to about 0.01 dB for tone amplitude.
 * - blackmanharris: the 4-term, −92 dB Blackman–Harris of Harris 1978 (Table 1 / eq. 33).
 */
export const WINDOW_COEFFICIENTS: Readonly<Record<WindowName, readonly number[]>> = {
  hann: [0.5, 0.5],
  flattop: [0.21557895, 0.41663158, 0.277263158, 0.083578947, 0.006947368],
  blackmanharris: [0.35875, 0.48829, 0.14128, 0.01168],
};

/**
 * The periodic ("DFT-even") window of a given length: the first N points of the (N+1)-point
 * symmetric window, which is what spectral analysis needs (scipy.signal.get_window with
 * fftbins=True, as scipy.signal.welch uses; MATLAB's 'periodic' option).
 *
 *   w[n] = Σₖ (−1)ᵏ·aₖ·cos(2πkn/N),  n = 0 … N−1
 *
 * Source: coefficients in {@link WINDOW_COEFFICIENTS}. Units: dimensionless.
 * Domain: name one of {@link WindowName}; length an integer ≥ 2 (a periodic window of one
 * point is its zero at n = 0 and carries no energy).
 * Bad input: unknown name or a length that is not an integer ≥ 2 → RangeError starting with
 * "windowCoefficients".
 *
 * @example windowCoefficients('hann', 4); // Float64Array [0, 0.5, 1, 0.5]
 */
export function windowCoefficients(name: WindowName, length: number): Float64Array {
  if (!Object.hasOwn(WINDOW_COEFFICIENTS, name)) {
    throw new RangeError(`windowCoefficients: unknown window ${JSON.stringify(name)}`);
  }
  if (!Number.isInteger(length) || length < 2) {
    throw new RangeError(`windowCoefficients: length must be an integer ≥ 2, got ${length}`);
  }
  const a = WINDOW_COEFFICIENTS[name];
  const w = new Float64Array(length);
  for (let n = 0; n < length; n++) {
    let sum = 0;
    for (let k = 0; k < a.length; k++) {
      // Reduce k·n modulo N before scaling so the angle stays exact for long windows.
      const angle = (2 * Math.PI * ((k * n) % length)) / length;
      sum += (k % 2 === 0 ? 1 : -1) * a[k] * Math.cos(angle);
    }
    w[n] = sum;
  }
  return w;
}
