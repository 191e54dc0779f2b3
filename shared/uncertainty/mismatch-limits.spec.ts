import { mismatchLimitsDb } from './mismatch-limits';
import {
  reflectionCoefficientFromVswr,
  vswrFromReflectionCoefficient,
} from './reflection-coefficient';

describe('reflection coefficient ↔ VSWR (transmission-line relation)', () => {
  it.each([
    [1, 0],
    [1.5, 0.2],
    [2, 1 / 3],
    [3, 0.5],
  ])('VSWR %p ↔ |Γ| %p', (vswr, gamma) => {
    expect(reflectionCoefficientFromVswr(vswr)).toBeCloseTo(gamma, 15);
    expect(vswrFromReflectionCoefficient(gamma)).toBeCloseTo(vswr, 12);
  });

  it('an open or short (VSWR ∞) is |Γ| = 1 and back', () => {
    expect(reflectionCoefficientFromVswr(Infinity)).toBe(1);
    expect(vswrFromReflectionCoefficient(1)).toBe(Infinity);
  });

  it('throws outside the domain', () => {
    expect(() => reflectionCoefficientFromVswr(0.9)).toThrow(
      /^reflectionCoefficientFromVswr: vswr must be ≥ 1/,
    );
    expect(() => reflectionCoefficientFromVswr(NaN)).toThrow(RangeError);
    expect(() => vswrFromReflectionCoefficient(1.1)).toThrow(/^vswrFromReflectionCoefficient: /);
    expect(() => vswrFromReflectionCoefficient(-0.1)).toThrow(RangeError);
  });
});

describe('mismatchLimitsDb: 20·log10(1 ± |Γs||Γl|) (published relation)', () => {
  it('VSWR 1.5 and 2.0: +0.5606 / −0.5993 dB (hand-computed from |Γ| = 0.2 and 1/3)', () => {
    const r = mismatchLimitsDb(1.5, 2);
    expect(r.gammaSource).toBeCloseTo(0.2, 15);
    expect(r.gammaLoad).toBeCloseTo(1 / 3, 15);
    expect(r.upperDb).toBeCloseTo(0.560574472, 8);
    expect(r.lowerDb).toBeCloseTo(-0.599264468, 8);
    expect(r.halfWidthDb).toBeCloseTo(0.599264468, 8);
  });

  it('a matched side gives no mismatch error, and the order of source and load does not matter', () => {
    expect(mismatchLimitsDb(1, 3)).toMatchObject({ upperDb: 0, halfWidthDb: 0 });
    expect(mismatchLimitsDb(1.2, 1.8)).toEqual({
      ...mismatchLimitsDb(1.8, 1.2),
      gammaSource: reflectionCoefficientFromVswr(1.2),
      gammaLoad: reflectionCoefficientFromVswr(1.8),
    });
  });

  it('is −Infinity dB below for two total reflections', () => {
    expect(mismatchLimitsDb(Infinity, Infinity).lowerDb).toBe(-Infinity);
  });

  it('throws with its own name', () => {
    expect(() => mismatchLimitsDb(0.5, 1.2)).toThrow(/^mismatchLimitsDb: vswr must be ≥ 1/);
    expect(() => mismatchLimitsDb(1.2, NaN)).toThrow(RangeError);
  });
});
