import fc from 'fast-check';
import {
  dbmToDbw,
  dbmToMilliwatts,
  dbmToWatts,
  dbwToDbm,
  milliwattsToDbm,
  wattsToDbm,
} from './power-level-conversions';

// Definitions: dBm = 10·log10(P / 1 mW), dBW = dBm − 30 (ITU-R V.574).
describe('dBm ↔ W ↔ mW', () => {
  it.each([
    // [levelDbm, watts] — by definition of dBm
    [0, 1e-3],
    [30, 1],
    [50, 100],
    [60, 1000],
    [-30, 1e-6],
    [37.78151250383644, 6], // 10·log10(6000): 6 W (hand arithmetic)
  ])('%p dBm is %p W', (levelDbm, watts) => {
    expect(dbmToWatts(levelDbm)).toBeCloseTo(watts, 12);
    expect(wattsToDbm(watts)).toBeCloseTo(levelDbm, 12);
  });

  it('converts to and from milliwatts (definition of dBm)', () => {
    expect(dbmToMilliwatts(0)).toBe(1);
    expect(dbmToMilliwatts(-10)).toBeCloseTo(0.1, 15);
    expect(milliwattsToDbm(1000)).toBe(30);
  });

  it('dBW = dBm − 30 (definition)', () => {
    expect(dbmToDbw(43)).toBe(13);
    expect(dbwToDbm(-13)).toBe(17);
  });

  it('treats zero power as -Infinity dBm in both directions', () => {
    expect(wattsToDbm(0)).toBe(-Infinity);
    expect(dbmToWatts(-Infinity)).toBe(0);
    expect(milliwattsToDbm(0)).toBe(-Infinity);
  });

  it('throws with the function name on bad input', () => {
    expect(() => dbmToWatts(NaN)).toThrow(/^dbmToWatts: /);
    expect(() => dbmToWatts(Infinity)).toThrow(RangeError);
    expect(() => wattsToDbm(-1)).toThrow(/^wattsToDbm: powerW must be 0 or more/);
    expect(() => wattsToDbm(Infinity)).toThrow(RangeError);
    expect(() => milliwattsToDbm(NaN)).toThrow(/^milliwattsToDbm: /);
    expect(() => dbmToDbw(-Infinity)).toThrow(/^dbmToDbw: /);
    expect(() => dbwToDbm(NaN)).toThrow(/^dbwToDbm: /);
    expect(() => dbmToWatts('10' as unknown as number)).toThrow(TypeError);
  });

  it('round-trips dBm → W → dBm and dBm → dBW → dBm (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -200, max: 100, noNaN: true }), (levelDbm) => {
        expect(wattsToDbm(dbmToWatts(levelDbm))).toBeCloseTo(levelDbm, 9);
        expect(milliwattsToDbm(dbmToMilliwatts(levelDbm))).toBeCloseTo(levelDbm, 9);
        expect(dbwToDbm(dbmToDbw(levelDbm))).toBeCloseTo(levelDbm, 12);
      }),
      { seed: 1157, numRuns: 300 },
    );
  });
});
