import { complexFftOfSize, isPowerOfTwo } from './fft';

/**
 * Forward or inverse DFT of any length N ≥ 1, in place on split arrays (re, im):
 *
 *   forward: X[k] = Σₙ x[n]·e^(−j2πkn/N)        inverse: x[n] = (1/N)·Σₖ X[k]·e^(+j2πkn/N)
 *
 * Power-of-two lengths go straight to fft.js; other lengths use Bluestein's chirp-z algorithm,
 * which rewrites nk = (n² + k² − (k−n)²)/2 so the DFT becomes a convolution with the chirp
 * e^(jπm²/N), evaluated with power-of-two FFTs of length M ≥ 2N − 1. This is the exact DFT of
 * the N given points (zero padding the signal itself would change the result), at O(M log M).
 *
 * Source: L. I. Bluestein, "A linear filtering approach to the computation of discrete Fourier
 * transform", IEEE Trans. Audio Electroacoust. 18(4), 1970; L. R. Rabiner et al., "The chirp
 * z-transform algorithm", same journal 17(2), 1969.
 * Precision: the chirp angle uses n² mod 2N, exact in doubles for N < 9·10⁷; round-off is about
 * 1e-15·log2(M) relative to the largest component. Memory: three buffers of 2M doubles plus the
 * FFT tables, roughly 100–200 bytes per input sample (a 10 s, 48 kS/s record: ~70 MB).
 * Domain: re and im of equal length ≥ 1 (not checked here: internal to this package's callers).
 *
 * @example
 * const re = Float64Array.of(1, 2, 3), im = new Float64Array(3);
 * anyLengthDft(re, im, 'forward'); // re ≈ [6, -1.5, -1.5], im ≈ [0, 0.866, -0.866]
 */
export function anyLengthDft(
  re: Float64Array,
  im: Float64Array,
  direction: 'forward' | 'inverse',
): void {
  const n = re.length;
  const sign = direction === 'forward' ? 1 : -1;
  if (isPowerOfTwo(n)) {
    const fft = complexFftOfSize(n);
    const a = fft.createBuffer();
    const b = fft.createBuffer();
    for (let k = 0; k < n; k++) {
      a[2 * k] = re[k];
      a[2 * k + 1] = sign * im[k]; // inverse via conjugation: x = conj(DFT(conj(X)))/N
    }
    fft.forward(a, b);
    const scale = direction === 'forward' ? 1 : 1 / n;
    for (let k = 0; k < n; k++) {
      re[k] = b[2 * k] * scale;
      im[k] = sign * b[2 * k + 1] * scale;
    }
    return;
  }
  let m = 1;
  while (m < 2 * n - 1) m *= 2;
  const fft = complexFftOfSize(m);
  // Chirp c[n] = e^(−jπn²/N); a = x·c, b = conj(c) wrapped for a circular convolution.
  const cRe = new Float64Array(n);
  const cIm = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const angle = (Math.PI * ((k * k) % (2 * n))) / n;
    cRe[k] = Math.cos(angle);
    cIm[k] = -Math.sin(angle);
  }
  // Plain arrays, as the Welch loop uses, keep fft.js monomorphic in one process.
  const a = fft.createBuffer();
  const b = fft.createBuffer();
  for (let k = 0; k < n; k++) {
    const xr = re[k];
    const xi = sign * im[k];
    a[2 * k] = xr * cRe[k] - xi * cIm[k];
    a[2 * k + 1] = xr * cIm[k] + xi * cRe[k];
    b[2 * k] = cRe[k];
    b[2 * k + 1] = -cIm[k];
    if (k > 0) {
      b[2 * (m - k)] = cRe[k];
      b[2 * (m - k) + 1] = -cIm[k];
    }
  }
  // Three buffers of 2M numbers in turn: a → fa, b → a (a is spent), fa·a → fa, IDFT(fa) → a.
  const fa = fft.createBuffer();
  fft.forward(a, fa);
  fft.forward(b, a);
  for (let k = 0; k < m; k++) {
    const ar = fa[2 * k];
    const ai = fa[2 * k + 1];
    const br = a[2 * k];
    const bi = a[2 * k + 1];
    fa[2 * k] = ar * br - ai * bi;
    fa[2 * k + 1] = ar * bi + ai * br;
  }
  fft.inverse(fa, a);
  const scale = direction === 'forward' ? 1 : 1 / n;
  for (let k = 0; k < n; k++) {
    const yr = a[2 * k];
    const yi = a[2 * k + 1];
    re[k] = (yr * cRe[k] - yi * cIm[k]) * scale;
    im[k] = sign * (yr * cIm[k] + yi * cRe[k]) * scale;
  }
}
