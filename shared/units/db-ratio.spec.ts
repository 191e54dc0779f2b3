import fc from 'fast-check';
import { dbToLinearPower, linearPowerToDb } from './db-ratio';

// Decibel definition for power ratios (IEC 60027-3): dB = 10·log10(r).
describe('dB ↔ linear power ratio', () => {
  it.each([
    [0, 1],
    [10, 10],
    [20, 100],
    [-3.010299956639812, 0.5], // 10·log10(2) (hand arithmetic)
    [6.020599913279624, 4], // 20·log10(2)
  ])('%p dB is a ratio of %p', (db, ratio) => {
    expect(dbToLinearPower(db)).toBeCloseTo(ratio, 12);
    expect(linearPowerToDb(ratio)).toBeCloseTo(db, 12);
  });

  it('maps -Infinity dB to 0 and 0 to -Infinity dB', () => {
    expect(dbToLinearPower(-Infinity)).toBe(0);
    expect(linearPowerToDb(0)).toBe(-Infinity);
  });

  it('throws RangeError starting with the function name', () => {
    expect(() => dbToLinearPower(NaN)).toThrow(/^dbToLinearPower: /);
    expect(() => dbToLinearPower(Infinity)).toThrow(RangeError);
    expect(() => linearPowerToDb(-0.1)).toThrow(/^linearPowerToDb: /);
    expect(() => linearPowerToDb(NaN)).toThrow(RangeError);
  });

  it('round-trips (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -250, max: 250, noNaN: true }), (db) => {
        expect(linearPowerToDb(dbToLinearPower(db))).toBeCloseTo(db, 9);
      }),
      { seed: 74, numRuns: 300 },
    );
  });
});
