import { formatMoney } from './format-money';
import { CURRENCY_MINOR_UNITS } from '../../shared/schemas/billing';

// Independent reference: the ICU/CLDR currency formatter built into Node (Intl.NumberFormat with
// the ISO code displayed), which carries its own table of currency decimals.
const intl = (amountMajor: number, currency: string) =>
  new Intl.NumberFormat('en-GB', { style: 'currency', currency, currencyDisplay: 'code' })
    .format(amountMajor)
    .replace(/\u00a0/g, ' ');

describe('formatMoney', () => {
  it.each([
    [18000, 'GBP', 180],
    [80000, 'GBP', 800],
    [290000, 'GBP', 2900],
    [5, 'EUR', 0.05],
    [0, 'USD', 0],
    [123456789, 'CHF', 1234567.89],
    [1200, 'JPY', 1200],
    [99999999, 'SEK', 999999.99],
  ])('%i minor units of %s read as Intl prints %d', (minor, currency, major) => {
    expect(formatMoney(minor, currency)).toBe(intl(major, currency));
  });

  it.each([[-1], [1.5], [Number.NaN], [2 ** 60]])('refuses %d with a RangeError', (amount) => {
    expect(() => formatMoney(amount, 'GBP')).toThrow(RangeError);
    expect(() => formatMoney(amount, 'GBP')).toThrow(/^formatMoney:/);
  });

  it('refuses a currency it has no minor unit for', () => {
    expect(() => formatMoney(100, 'XYZ')).toThrow(/^formatMoney: unknown currency/);
  });

  it.each(Object.entries(CURRENCY_MINOR_UNITS))(
    'the minor unit of %s (%i) agrees with CLDR',
    (currency, exponent) => {
      const format = new Intl.NumberFormat('en-GB', { style: 'currency', currency });
      expect(format.resolvedOptions().maximumFractionDigits).toBe(exponent);
    },
  );
});
