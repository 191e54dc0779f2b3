import fc from 'fast-check';
import { formatNecessaryBandwidth, parseNecessaryBandwidthCode } from './necessary-bandwidth-code';

describe('necessary-bandwidth code (RR Appendix 1 §1, 47 CFR 2.202)', () => {
  it.each([
    // published: 400 Hz, 2.7 kHz, 12.5 kHz, 180.5 kHz
    [400, '400H'],
    [2700, '2K70'],
    [12_500, '12K5'],
    [180_500, '181K'],
    // further RR Appendix 1 examples (from memory)
    [0.002, 'H002'],
    [0.1, 'H100'],
    [25.3, '25H3'],
    [2400, '2K40'],
    [6000, '6K00'],
    [180_400, '180K'],
    [180_700, '181K'],
    [1_250_000, '1M25'],
    [2_000_000, '2M00'],
    [10_000_000, '10M0'],
    [202_000_000, '202M'],
    [5_650_000_000, '5G65'],
  ])('%p Hz ↔ %p', (hz, code) => {
    expect(formatNecessaryBandwidth(hz)).toBe(code);
    expect(parseNecessaryBandwidthCode(code)).toBeCloseTo(
      Math.abs(hz) < 1 ? hz : Number(hz.toPrecision(3)),
      12,
    );
  });

  it('rounds to three significant figures, carrying into the next unit (arithmetic)', () => {
    expect(formatNecessaryBandwidth(999.5)).toBe('1K00');
    expect(formatNecessaryBandwidth(0.9996)).toBe('1H00');
    expect(formatNecessaryBandwidth(0.9994)).toBe('H999');
    expect(formatNecessaryBandwidth(2376)).toBe('2K38');
    expect(formatNecessaryBandwidth(999e9)).toBe('999G');
  });

  it('format(parse(code)) gives the code back, and parse(format(hz)) is within rounding (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 9.9e11, noNaN: true }), (hz) => {
        const code = formatNecessaryBandwidth(hz);
        expect(code).toMatch(/^[1-9][0-9HKMG]{3}$/);
        expect(formatNecessaryBandwidth(parseNecessaryBandwidthCode(code))).toBe(code);
        expect(Math.abs(parseNecessaryBandwidthCode(code) / hz - 1)).toBeLessThanOrEqual(
          0.005 + 1e-12,
        );
      }),
      { seed: 2202, numRuns: 500 },
    );
  });

  it.each([
    [0, /greater than 0/],
    [-5, /greater than 0/],
    [0.0004, /below 0.001 Hz/],
    [1e12, /1000 GHz or more/],
    [NaN, /finite/],
    [Infinity, /finite/],
  ])('format rejects %p', (hz, message) => {
    expect(() => formatNecessaryBandwidth(hz)).toThrow(message);
    expect(() => formatNecessaryBandwidth(hz)).toThrow(/^formatNecessaryBandwidth: /);
  });

  it.each([
    ['2K7', /must be 4 characters/],
    ['2K700', /must be 4 characters/],
    ['2X70', /must be 4 characters/],
    ['2700', /exactly one unit letter/],
    ['2KK0', /exactly one unit letter/],
    ['0K50', /may not start with 0, K, M or G/],
    ['K500', /may not start with 0, K, M or G/],
    ['H000', /zero bandwidth/],
  ])('parse rejects %p', (code, message) => {
    expect(() => parseNecessaryBandwidthCode(code)).toThrow(message);
    expect(() => parseNecessaryBandwidthCode(code)).toThrow(/^parseNecessaryBandwidthCode: /);
  });
});
