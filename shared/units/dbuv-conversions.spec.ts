import fc from 'fast-check';
import { dbmToDbuv, dbuvToDbm } from './dbuv-conversions';
import { dbmToWatts } from './power-level-conversions';

describe('dBµV ↔ dBm', () => {
  it('60 dBµV is −46.99 dBm at 50 Ω (published conversion, dBµV = dBm + 107 at 50 Ω)', () => {
    expect(dbuvToDbm(60)).toBeCloseTo(-46.99, 2);
    expect(dbmToDbuv(-46.99)).toBeCloseTo(60, 2);
  });

  it('1 V across 50 Ω (120 dBµV) is 20 mW by P = V²/R', () => {
    expect(dbmToWatts(dbuvToDbm(120))).toBeCloseTo(1 / 50, 12);
  });

  it('1 V across 75 Ω is 13.33 mW by P = V²/R', () => {
    expect(dbmToWatts(dbuvToDbm(120, 75))).toBeCloseTo(1 / 75, 12);
  });

  it('matches P = V²/R for random voltages and resistances (property, seeded)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-7, max: 1e3, noNaN: true }),
        fc.double({ min: 1, max: 1e4, noNaN: true }),
        (volts, ohms) => {
          const levelDbuv = 20 * Math.log10(volts / 1e-6); // definition of dBµV
          expect(dbmToWatts(dbuvToDbm(levelDbuv, ohms)) / ((volts * volts) / ohms)).toBeCloseTo(
            1,
            9,
          );
          expect(dbmToDbuv(dbuvToDbm(levelDbuv, ohms), ohms)).toBeCloseTo(levelDbuv, 9);
        },
      ),
      { seed: 2022, numRuns: 200 },
    );
  });

  it('rejects non-finite levels and non-positive impedances', () => {
    expect(() => dbuvToDbm(NaN)).toThrow(/^dbuvToDbm: levelDbuv/);
    expect(() => dbuvToDbm(-Infinity)).toThrow(RangeError);
    expect(() => dbuvToDbm(60, 0)).toThrow(/^dbuvToDbm: impedanceOhm/);
    expect(() => dbmToDbuv(0, -50)).toThrow(/^dbmToDbuv: impedanceOhm/);
    expect(() => dbmToDbuv(Infinity)).toThrow(/^dbmToDbuv: /);
  });
});
