import { createComplexNoise } from './gaussian-noise';

describe('createComplexNoise', () => {
  const n = 200000;
  const i = new Float64Array(n);
  const q = new Float64Array(n);
  createComplexNoise({ powerLinear: 2, seed: 1 }).addTo(i, q, 0, n);

  it('has the requested total power, split evenly between I and Q, zero mean', () => {
    let pi = 0;
    let pq = 0;
    let mean = 0;
    let cross = 0;
    for (let k = 0; k < n; k++) {
      pi += (i[k] * i[k]) / n;
      pq += (q[k] * q[k]) / n;
      mean += i[k] / n;
      cross += (i[k] * q[k]) / n;
    }
    // Sample variance of a χ² estimate over 2e5 values: ±1 % is > 4σ.
    expect(pi + pq).toBeGreaterThan(1.98);
    expect(pi + pq).toBeLessThan(2.02);
    expect(pi / pq).toBeCloseTo(1, 1);
    expect(Math.abs(mean)).toBeLessThan(0.01);
    expect(Math.abs(cross)).toBeLessThan(0.01); // I and Q uncorrelated
  });

  it('is Gaussian: 68.27 % within ±1σ and 95.45 % within ±2σ (normal distribution tables)', () => {
    let one = 0;
    let two = 0;
    for (let k = 0; k < n; k++) {
      const z = Math.abs(i[k]); // σ = 1 per axis for power 2
      if (z < 1) one++;
      if (z < 2) two++;
    }
    expect(one / n).toBeCloseTo(0.6827, 2);
    expect(two / n).toBeCloseTo(0.9545, 2);
  });

  it('adds to what is there, and repeats for a seed', () => {
    const a = Float32Array.of(1, 1);
    const b = new Float32Array(2);
    createComplexNoise({ powerLinear: 0, seed: 3 }).addTo(a, b, 0, 2);
    expect(Array.from(a)).toEqual([1, 1]);
    const x = new Float64Array(4);
    const y = new Float64Array(4);
    createComplexNoise({ powerLinear: 1, seed: 3 }).addTo(x, y, 0, 4);
    const x2 = new Float64Array(4);
    createComplexNoise({ powerLinear: 1, seed: 3 }).addTo(x2, new Float64Array(4), 0, 4);
    expect(Array.from(x2)).toEqual(Array.from(x));
  });

  it('rejects negative or non-finite power and a non-integer seed', () => {
    const make = (powerLinear: number, seed: number) => () =>
      createComplexNoise({ powerLinear, seed });
    expect(make(-1, 1)).toThrow(/^createComplexNoise: powerLinear/);
    expect(make(NaN, 1)).toThrow(/^createComplexNoise: powerLinear/);
    expect(make(1, 0.5)).toThrow(/^createComplexNoise: seed/);
  });
});
