import fc from 'fast-check';
import { niceTicks } from './nice-ticks';

// Worked by hand from Heckbert's rule (Graphics Gems, 1990): raw step = range / 5, rounded to
// 1, 2 or 5 times a power of ten, axis widened to whole steps.
describe('niceTicks', () => {
  it.each([
    // min, max, step, lo, hi
    [0, 100, 20, 0, 100], // raw 20: normalised 2 -> 2 x 10
    [-3, 47, 10, -10, 50], // raw 10: normalised 1 -> 1 x 10
    [-72.4, 0.8, 10, -80, 10], // raw 14.64: normalised 1.464 < 1.5 -> 1 x 10
    [-12000, 12000, 5000, -15000, 15000], // raw 4800: normalised 4.8 < 7 -> 5 x 1000
    [0.1, 0.93, 0.2, 0, 1], // raw 0.166: normalised 1.66 < 3 -> 2 x 0.1
  ])('data %p..%p -> step %p on %p..%p', (min, max, step, lo, hi) => {
    const t = niceTicks(min, max);
    expect([t.step, t.lo, t.hi]).toEqual([step, lo, hi]);
  });

  it('uses decimals for small steps without float dust', () => {
    const t = niceTicks(0, 1);
    expect(t.step).toBe(0.2);
    expect(t.ticks).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(t.decimals).toBe(1);
  });

  it('widens a zero-width range around the value', () => {
    expect(niceTicks(5, 5).lo).toBeLessThan(5);
    expect(niceTicks(5, 5).hi).toBeGreaterThan(5);
    expect(niceTicks(0, 0).ticks.length).toBeGreaterThan(1);
  });

  it('rejects bad input with its name', () => {
    expect(() => niceTicks(Number.NaN, 1)).toThrow(/^niceTicks: /);
    expect(() => niceTicks(2, 1)).toThrow(/^niceTicks: /);
    expect(() => niceTicks(0, 1, 0)).toThrow(/^niceTicks: /);
  });

  it('always encloses the data on steps of 1, 2 or 5 x 10^k with a sensible count (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
        (min, span) => {
        const t = niceTicks(min, min + span);
        const mantissa = t.step / 10 ** Math.floor(Math.log10(t.step) + 1e-9);
        expect([1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-6)).toBe(true);
        // A bound within 1e-9 step of a tick counts as on it (by design), hence the tolerance.
        expect(t.lo).toBeLessThanOrEqual(min + 1e-6 * t.step);
        expect(t.hi).toBeGreaterThanOrEqual(min + span - 1e-6 * t.step);
        expect(t.ticks.length).toBeGreaterThanOrEqual(3);
        expect(t.ticks.length).toBeLessThanOrEqual(13);
        },
      ),
      { seed: 20250310, numRuns: 300 },
    );
  });
});
