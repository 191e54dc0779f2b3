import { decimateMinMax } from './min-max-decimation';

describe('decimateMinMax', () => {
  it('keeps every bucket extreme of a long trace (the drawn envelope loses no peak)', () => {
    // 10 000 points of a seeded pseudo-random trace (Park-Miller generator) with one narrow spur.
    let state = 12345;
    const next = () => ((state = (state * 16807) % 2147483647) - 1) / 2147483646;
    const n = 10_000;
    const x = Array.from({ length: n }, (_, i) => i);
    const y = x.map(() => -70 + 6 * next());
    y[6123] = -12; // a one-point spur must survive
    const out = decimateMinMax(x, y, 500);
    expect(out.x.length).toBeLessThanOrEqual(3 * 500 + 1);
    expect(out.y).toContain(-12);
    // Independent check: per bucket of 20 input points, its max and min appear in the output.
    for (let b = 0; b < 500; b++) {
      const slice = y.slice(b * 20, b * 20 + 20);
      expect(out.y).toContain(Math.max(...slice));
      expect(out.y).toContain(Math.min(...slice));
    }
    for (let i = 1; i < out.x.length; i++) expect(out.x[i]).toBeGreaterThanOrEqual(out.x[i - 1]);
  });

  it('returns short traces unchanged (as copies)', () => {
    const x = [0, 1, 2];
    const out = decimateMinMax(x, [5, 6, 7], 10);
    expect(out).toEqual({ x: [0, 1, 2], y: [5, 6, 7] });
    expect(out.x).not.toBe(x);
  });

  it('matches its documented example', () => {
    expect(decimateMinMax([0, 1, 2, 3, 4, 5, 6], [0, 5, 1, 1, 9, 0, 2], 1)).toEqual({
      x: [0, 4],
      y: [0, 9],
    });
  });

  it('keeps gaps as NaN so the line is broken there', () => {
    const x = Array.from({ length: 40 }, (_, i) => i);
    const y = x.map((i) => (i >= 10 && i < 20 ? Number.NaN : i));
    const out = decimateMinMax(x, y, 4);
    expect(out.y.some(Number.isNaN)).toBe(true);
  });

  it('rejects unequal lengths and bad bucket counts', () => {
    expect(() => decimateMinMax([1, 2], [1], 1)).toThrow(/^decimateMinMax: /);
    expect(() => decimateMinMax([1], [1], 0)).toThrow(/^decimateMinMax: /);
  });
});
