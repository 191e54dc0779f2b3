import { CompensatedSum, compensatedSum } from './compensated-sum';

describe('compensatedSum', () => {
  it('recovers terms lost to cancellation (Neumaier 1974 example form)', () => {
    expect(compensatedSum([1, 1e100, 1, -1e100])).toBe(2);
    // a plain loop loses both ones
    expect([1, 1e100, 1, -1e100].reduce((a, b) => a + b, 0)).toBe(0);
  });

  it('sums a million 0.1 terms to within one rounding of 100000 (a plain loop drifts ~1e-6)', () => {
    const values = new Float64Array(1_000_000).fill(0.1);
    expect(Math.abs(compensatedSum(values) - 100000)).toBeLessThan(2e-11);
    expect(Math.abs(values.reduce((a, b) => a + b, 0) - 100000)).toBeGreaterThan(1e-7);
  });

  it('is 0 for an empty input and tracks a running value', () => {
    expect(compensatedSum([])).toBe(0);
    const acc = new CompensatedSum();
    acc.add(0.5);
    expect(acc.value).toBe(0.5);
    acc.add(0.25);
    expect(acc.value).toBe(0.75);
  });
});
