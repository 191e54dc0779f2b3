import { anyLengthDft } from './any-length-dft';
import { createMulberry32 } from './mulberry32';

/** Direct O(n²) DFT from the definition X[k] = Σ x[n]·e^(−j2πkn/N). */
function directDft(re: Float64Array, im: Float64Array): { re: Float64Array; im: Float64Array } {
  const n = re.length;
  const out = { re: new Float64Array(n), im: new Float64Array(n) };
  for (let k = 0; k < n; k++) {
    for (let t = 0; t < n; t++) {
      const a = (-2 * Math.PI * ((k * t) % n)) / n;
      out.re[k] += re[t] * Math.cos(a) - im[t] * Math.sin(a);
      out.im[k] += re[t] * Math.sin(a) + im[t] * Math.cos(a);
    }
  }
  return out;
}

describe('anyLengthDft', () => {
  it('transforms [1, 2, 3] to [6, −1.5 + 0.866j, −1.5 − 0.866j] (definition, by hand)', () => {
    const re = Float64Array.of(1, 2, 3);
    const im = new Float64Array(3);
    anyLengthDft(re, im, 'forward');
    [6, -1.5, -1.5].forEach((v, k) => expect(re[k]).toBeCloseTo(v, 13));
    expect(im[0]).toBeCloseTo(0, 13);
    expect(im[1]).toBeCloseTo(Math.sqrt(3) / 2, 13);
    expect(im[2]).toBeCloseTo(-Math.sqrt(3) / 2, 13);
  });

  it.each([1, 2, 3, 5, 7, 12, 100, 127, 1000])('agrees with the direct DFT, N = %i', (n) => {
    const next = createMulberry32(n);
    const re = Float64Array.from({ length: n }, () => next() - 0.5);
    const im = Float64Array.from({ length: n }, () => next() - 0.5);
    const reference = directDft(re, im);
    const [xr, xi] = [Float64Array.from(re), Float64Array.from(im)];
    anyLengthDft(xr, xi, 'forward');
    // Bluestein's round-off grows like log2(M)·ε·max|X|; 1e-10 absolute holds to N = 1000.
    for (let k = 0; k < n; k++) {
      expect(Math.abs(xr[k] - reference.re[k])).toBeLessThan(1e-10);
      expect(Math.abs(xi[k] - reference.im[k])).toBeLessThan(1e-10);
    }
    anyLengthDft(xr, xi, 'inverse'); // and inverts itself
    for (let k = 0; k < n; k++) {
      expect(Math.abs(xr[k] - re[k])).toBeLessThan(1e-12);
      expect(Math.abs(xi[k] - im[k])).toBeLessThan(1e-12);
    }
  });
});
