import { pepFromPeakVoltageW } from './pep-from-peak-voltage';

describe('pepFromPeakVoltageW', () => {
  it('100 V peak into 50 Ω is 100 W (published relation PEP = (Vpk·0.707)²/R)', () => {
    expect(pepFromPeakVoltageW(100, 50)).toBeCloseTo(100, 12);
  });

  it('agrees with the rounded 0.707 form to within its rounding (0.02 %)', () => {
    expect(pepFromPeakVoltageW(316.2, 50) / ((316.2 * 0.707) ** 2 / 50)).toBeCloseTo(1, 3);
  });

  it('is the RMS-of-crest power: 1 kW into 50 Ω needs 316.23 V peak (hand arithmetic √(2·50·1000))', () => {
    expect(pepFromPeakVoltageW(Math.sqrt(2 * 50 * 1000), 50)).toBeCloseTo(1000, 9);
  });

  it('is 0 for 0 V and throws on bad input', () => {
    expect(pepFromPeakVoltageW(0, 50)).toBe(0);
    expect(() => pepFromPeakVoltageW(-1, 50)).toThrow(/^pepFromPeakVoltageW: peakV/);
    expect(() => pepFromPeakVoltageW(10, 0)).toThrow(/^pepFromPeakVoltageW: resistanceOhm/);
    expect(() => pepFromPeakVoltageW(NaN, 50)).toThrow(RangeError);
    expect(() => pepFromPeakVoltageW(10, Infinity)).toThrow(RangeError);
  });
});
