import { retryDelayMs } from './retry-delay';

describe('retryDelayMs', () => {
  const settings = { retryBaseMs: 1000, retryCapMs: 300_000 };

  // Exponential backoff, base 1 s doubling (1, 2, 4, 8 … s), capped at 5 min: worked by hand.
  it.each([
    [1, 1000],
    [2, 2000],
    [3, 4000],
    [9, 256_000],
    [10, 300_000], // 512 s would exceed the cap
    [1000, 300_000],
  ])('after %d failure(s) waits %d ms', (failures, expected) => {
    expect(retryDelayMs(failures, settings)).toBe(expected);
  });

  it('throws RangeError for impossible inputs', () => {
    expect(() => retryDelayMs(0, settings)).toThrow(/^retryDelayMs/);
    expect(() => retryDelayMs(1.5, settings)).toThrow(RangeError);
    expect(() => retryDelayMs(1, { retryBaseMs: 0, retryCapMs: 10 })).toThrow(RangeError);
    expect(() => retryDelayMs(1, { retryBaseMs: 10, retryCapMs: 5 })).toThrow(RangeError);
  });
});
