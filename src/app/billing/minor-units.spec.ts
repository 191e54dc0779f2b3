import { toMajorText, toMinorUnits } from './minor-units';

// Minor units per ISO 4217 (from memory): GBP 2 decimals, JPY none; arithmetic by hand.
describe('toMinorUnits', () => {
  it.each([
    ['180', 'GBP', 18000],
    ['180.5', 'GBP', 18050],
    ['180.05', 'GBP', 18005],
    [' 2,900.00 ', 'GBP', 290000],
    ['0.01', 'GBP', 1],
    ['1200', 'JPY', 1200],
    ['999999.99', 'GBP', 99999999],
  ] as const)('%s %s is %i minor units', (text, currency, minor) => {
    expect(toMinorUnits(text, currency)).toBe(minor);
  });

  it.each([
    ['', 'GBP'],
    ['0', 'GBP'],
    ['0.00', 'GBP'],
    ['1.234', 'GBP'],
    ['1.5', 'JPY'],
    ['-5', 'GBP'],
    ['12,34', 'GBP'],
    ['1e3', 'GBP'],
    ['1000000.00', 'GBP'],
    ['abc', 'GBP'],
  ] as const)('refuses "%s" in %s', (text, currency) => {
    expect(toMinorUnits(text, currency)).toBeNull();
  });
});

describe('toMajorText', () => {
  it('is the inverse of toMinorUnits', () => {
    expect(toMajorText(18050, 'GBP')).toBe('180.50');
    expect(toMajorText(5, 'GBP')).toBe('0.05');
    expect(toMajorText(1200, 'JPY')).toBe('1200');
    for (const minor of [1, 99, 100, 18000, 99999999]) expect(toMinorUnits(toMajorText(minor, 'EUR'), 'EUR')).toBe(minor);
  });
});
