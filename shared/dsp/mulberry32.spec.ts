import { createMulberry32 } from './mulberry32';

describe('createMulberry32', () => {
  it('repeats its sequence for a seed and differs between seeds', () => {
    const a = createMulberry32(42);
    const b = createMulberry32(42);
    const c = createMulberry32(43);
    const first = Array.from({ length: 5 }, () => a());
    expect(Array.from({ length: 5 }, () => b())).toEqual(first);
    expect(Array.from({ length: 5 }, () => c())).not.toEqual(first);
  });

  it('is uniform on [0, 1): mean 1/2, variance 1/12, 10-cell χ² below the 0.1 % point', () => {
    // Uniform-distribution moments (textbook); χ²(9 dof) 0.999 quantile = 27.88 (tables).
    const next = createMulberry32(2024);
    const n = 100000;
    const cells = new Array<number>(10).fill(0);
    let sum = 0;
    let sumSq = 0;
    let [min, max] = [Infinity, -Infinity];
    for (let k = 0; k < n; k++) {
      const u = next();
      [min, max] = [Math.min(min, u), Math.max(max, u)];
      sum += u;
      sumSq += u * u;
      cells[Math.floor(u * 10)]++;
    }
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    const mean = sum / n;
    expect(mean).toBeCloseTo(0.5, 2);
    expect(sumSq / n - mean * mean).toBeCloseTo(1 / 12, 3);
    const chi2 = cells.reduce((s, c) => s + (c - n / 10) ** 2 / (n / 10), 0);
    expect(chi2).toBeLessThan(27.88);
  });

  it('rejects a non-integer seed', () => {
    expect(() => createMulberry32(1.5)).toThrow(/^createMulberry32: seed must be an integer/);
    expect(() => createMulberry32(NaN)).toThrow(/^createMulberry32/);
  });
});
