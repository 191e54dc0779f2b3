import { CACHED_FFT_MAX_SIZE, ComplexFft, complexFftOfSize, isPowerOfTwo } from './fft';
import { createMulberry32 } from './mulberry32';

// Independent reference: the npm package fft-js (recursive Cooley–Tukey, Vail Systems), a
// devDependency used only here. It ships no types, hence the narrow cast.
const fftJs = require('fft-js') as { fft(x: number[][]): number[][] };

/** Direct O(n²) DFT, X[k] = Σ x[n]·e^(−j2πkn/N): the definition itself. */
function directDft(re: number[], im: number[]): { re: number[]; im: number[] } {
  const n = re.length;
  const out = { re: new Array<number>(n).fill(0), im: new Array<number>(n).fill(0) };
  for (let k = 0; k < n; k++) {
    for (let t = 0; t < n; t++) {
      const a = (-2 * Math.PI * ((k * t) % n)) / n;
      out.re[k] += re[t] * Math.cos(a) - im[t] * Math.sin(a);
      out.im[k] += re[t] * Math.sin(a) + im[t] * Math.cos(a);
    }
  }
  return out;
}

function randomComplex(n: number, seed: number): { re: number[]; im: number[] } {
  const next = createMulberry32(seed);
  return {
    re: Array.from({ length: n }, () => 2 * next() - 1),
    im: Array.from({ length: n }, () => 2 * next() - 1),
  };
}

function interleave(re: number[], im: number[]): Float64Array {
  const out = new Float64Array(2 * re.length);
  re.forEach((v, k) => {
    out[2 * k] = v;
    out[2 * k + 1] = im[k];
  });
  return out;
}

describe('ComplexFft', () => {
  it('transforms [1, 2, 3, 4] to [10, −2+2j, −2, −2−2j] (the DFT definition, by hand)', () => {
    const out = new Float64Array(8);
    new ComplexFft(4).forward(Float64Array.of(1, 0, 2, 0, 3, 0, 4, 0), out);
    expect(Array.from(out)).toEqual([10, 0, -2, 2, -2, 0, -2, -2]);
  });

  it.each([64, 256, 1024, 4096])('agrees with fft-js on seeded random input, N = %i', (n) => {
    const x = randomComplex(n, n);
    const reference = fftJs.fft(x.re.map((v, k) => [v, x.im[k]]));
    const out = new Float64Array(2 * n);
    complexFftOfSize(n).forward(interleave(x.re, x.im), out);
    // Round-off of both O(n log n) algorithms on |X| ≲ √n·0.6: 1e-11 absolute is ample.
    for (let k = 0; k < n; k++) {
      expect(out[2 * k]).toBeCloseTo(reference[k][0], 11);
      expect(out[2 * k + 1]).toBeCloseTo(reference[k][1], 11);
    }
  });

  it.each([1, 2, 4, 8, 16, 32])('agrees with a direct O(n²) DFT, N = %i', (n) => {
    const x = randomComplex(n, 100 + n);
    const reference = directDft(x.re, x.im);
    const outRe = new Float64Array(n);
    const outIm = new Float64Array(n);
    new ComplexFft(n).forwardSplit(x.re, x.im, outRe, outIm);
    for (let k = 0; k < n; k++) {
      expect(outRe[k]).toBeCloseTo(reference.re[k], 12);
      expect(outIm[k]).toBeCloseTo(reference.im[k], 12);
    }
  });

  it('inverts its forward transform (round trip, 1/N scaling as numpy.fft.ifft)', () => {
    const x = randomComplex(512, 7);
    const input = interleave(x.re, x.im);
    const spectrum = new Float64Array(1024);
    const back = new Float64Array(1024);
    const fft = complexFftOfSize(512);
    fft.forward(input, spectrum);
    fft.inverse(spectrum, back);
    back.forEach((v, k) => expect(v).toBeCloseTo(input[k], 13));
  });

  it('reuses one instance (and its tables) per size, up to the cache limit', () => {
    expect(complexFftOfSize(2048)).toBe(complexFftOfSize(2048));
    const large = 2 * CACHED_FFT_MAX_SIZE;
    expect(complexFftOfSize(large)).not.toBe(complexFftOfSize(large));
  });

  it('rejects sizes that are not powers of two, and bad buffers, naming the method', () => {
    for (const size of [0, 3, 12, -4, 1.5, NaN, 2 ** 31]) {
      expect(() => new ComplexFft(size)).toThrow(/^ComplexFft: size must be a power of two/);
    }
    const fft = new ComplexFft(8);
    expect(() => fft.forward(new Float64Array(8), new Float64Array(16))).toThrow(
      /^ComplexFft\.forward: buffers must have length 16/,
    );
    const same = new Float64Array(16);
    expect(() => fft.inverse(same, same)).toThrow(/^ComplexFft\.inverse: input and output/);
    expect(() => fft.forwardSplit([1], [1], new Float64Array(8), new Float64Array(8))).toThrow(
      /^ComplexFft\.forwardSplit/,
    );
  });

  it('lets NaN through without a check (callers validate samples first)', () => {
    const out = new Float64Array(4);
    new ComplexFft(2).forward(Float64Array.of(NaN, 0, 1, 0), out);
    expect(Number.isNaN(out[0])).toBe(true);
  });

  it('isPowerOfTwo', () => {
    expect([1, 2, 1024, 2 ** 30].every(isPowerOfTwo)).toBe(true);
    expect([0, 3, 6, 2 ** 31, 0.5, Infinity].some(isPowerOfTwo)).toBe(false);
  });
});
