import { defaultDecimals, formatNumber } from './format-number';

describe('formatNumber', () => {
  it.each([
    [-3.456, 2, {}, '\u22123.46'], // rounding half away from zero at the shown digit (toFixed)
    [6.3, 1, { signed: true }, '+6.3'],
    [-0.001, 2, {}, '0.00'], // no "-0.00"
    [0, 2, { signed: true }, '0.00'], // zero carries no sign
    [2376, 0, {}, '2376'],
    [Number.NaN, 2, {}, '\u2014'],
  ])('%p with %p decimals %p -> %p', (value, decimals, options, expected) => {
    expect(formatNumber(value, decimals, options)).toBe(expected);
  });

  it('rejects impossible decimals', () => {
    expect(() => formatNumber(1, -1)).toThrow(/^formatNumber: /);
    expect(() => formatNumber(1, 1.5)).toThrow(/^formatNumber: /);
  });

  it('chooses about four significant figures (common practice)', () => {
    expect([defaultDecimals(46.31), defaultDecimals(-150.2), defaultDecimals(2376)]).toEqual([
      2,
      1,
      0,
    ]);
  });
});
