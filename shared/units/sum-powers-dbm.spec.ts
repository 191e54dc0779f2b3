import { sumPowersDbm } from './sum-powers-dbm';

describe('sumPowersDbm', () => {
  it('two tones of −10.00 dBm sum to −6.99 dBm (common practice: mean = 2·Pt)', () => {
    expect(sumPowersDbm([-10, -10])).toBeCloseTo(-6.99, 2);
  });

  it('ten equal levels add 10 dB; mixed levels add as 1 mW + 2 mW = 3 mW', () => {
    expect(sumPowersDbm(new Float64Array(10).fill(-20))).toBeCloseTo(-10, 12);
    expect(sumPowersDbm([0, 10 * Math.log10(2)])).toBeCloseTo(10 * Math.log10(3), 12);
  });

  it('keeps a million small bins next to a big one (compensated linear sum)', () => {
    const levels = new Float64Array(1_000_001).fill(-100);
    levels[0] = 0;
    // 1 mW + 1e6 · 1e-10 mW = 1.0001 mW (arithmetic)
    expect(sumPowersDbm(levels)).toBeCloseTo(10 * Math.log10(1.0001), 10);
  });

  it('does not overflow or underflow at extreme levels', () => {
    expect(sumPowersDbm([4000, 4000])).toBeCloseTo(4000 + 10 * Math.log10(2), 9);
    expect(sumPowersDbm([-4000, -4000])).toBeCloseTo(-4000 + 10 * Math.log10(2), 9);
  });

  it('ignores -Infinity (zero power); empty or all -Infinity is -Infinity', () => {
    expect(sumPowersDbm([-Infinity, -3])).toBe(-3);
    expect(sumPowersDbm([])).toBe(-Infinity);
    expect(sumPowersDbm([-Infinity])).toBe(-Infinity);
    expect(sumPowersDbm([7])).toBe(7);
  });

  it('throws on NaN or +Infinity naming the index, and on a non-array', () => {
    expect(() => sumPowersDbm([0, NaN])).toThrow(/^sumPowersDbm: levelsDbm\[1\]/);
    expect(() => sumPowersDbm([Infinity])).toThrow(RangeError);
    expect(() => sumPowersDbm(null as unknown as number[])).toThrow(TypeError);
  });
});
