import { formatMinorAmount } from './money-format';

describe('formatMinorAmount', () => {
  // Minor-unit digits from ISO 4217's list: EUR 2, JPY 0, KWD 3.
  it.each([
    [1999, 'eur', '€19.99'],
    [7400, 'EUR', '€74.00'],
    [500, 'jpy', 'JP¥500'],
    [1234, 'kwd', 'KWD 1.234'],
    [5, 'usd', 'US$0.05'],
  ])('%d %s → %s', (amount, currency, expected) => {
    expect(formatMinorAmount(amount, currency).replace(/\u00a0/g, ' ')).toBe(expected);
  });

  it('throws RangeError for an unknown currency code', () => {
    expect(() => formatMinorAmount(100, 'xx')).toThrow(RangeError);
  });
});
