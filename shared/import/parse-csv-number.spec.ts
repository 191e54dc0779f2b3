/**
 * parseCsvNumberAt reads the common field by Clinger's fast path (W. D. Clinger, "How to read
 * floating point numbers accurately", PLDI 1990: an integer below 2^53 times or divided by an
 * exact power of ten up to 10^22 rounds correctly in one IEEE operation). The reference for every
 * value is the JavaScript engine's own Number() (ECMAScript, StringToNumber), which rounds
 * correctly; the reference for what is refused is parseCsvNumber on the same text.
 */
import fc from 'fast-check';
import { parseCsvNumber, parseCsvNumberAt } from './parse-csv-number';

/** The field inside a line, so the reader must respect its bounds. */
const inLine = (field: string, decimalComma = false) => parseCsvNumberAt(`9,${field},-7`, 2, 2 + field.length, decimalComma);

describe('parseCsvNumberAt', () => {
  it('gives exactly what Number() gives for decimals of every shape (property, 20,000 cases)', () => {
    const digits = (max: number) => fc.string({ unit: fc.constantFrom(...'0123456789'), minLength: 0, maxLength: max });
    const decimal = fc
      .tuple(fc.constantFrom('', '+', '-'), digits(20), fc.boolean(), digits(20), fc.option(fc.tuple(fc.constantFrom('e', 'E'), fc.constantFrom('', '+', '-'), digits(3))))
      .map(([sign, int, point, frac, exp]) => `${sign}${int}${point ? '.' : ''}${point ? frac : ''}${exp ? exp.join('') : ''}`);
    fc.assert(
      fc.property(decimal, (field) => {
        expect(Object.is(inLine(field), parseCsvNumber(field, false))).toBe(true);
      }),
      { numRuns: 20_000 },
    );
  });

  it('matches Number() on the figures of real traces and on the edges of the fast path', () => {
    const cases = [
      '2170005.86', '-61.60', '0', '-0', '+0.5', '.5', '5.', '1e5', '1E+05', '2.5e-3', '123456789012345', '1234567890123456',
      '9007199254740993', '0.1', '0.3', '1e22', '1e23', '1e-22', '1e-23', '4.35e-7', '-1.7976931348623157e308', '000012.5000',
      '0.000000000000000000001', '3.0000000000000004', '27500000.000',
    ];
    for (const field of cases) expect(Object.is(inLine(field), Number(field))).toBe(true);
  });

  it('refuses what parseCsvNumber refuses, and reads quotes, spaces and decimal commas as it does', () => {
    for (const field of ['', '+', '-', '.', 'e5', '1e', '1e+', '0x10', 'Infinity', 'NaN', '1.2.3', '1e400', '12a', '--1']) {
      expect(inLine(field)).toBeNaN();
    }
    expect(inLine(' 1.5e3 ')).toBe(1500);
    expect(inLine('"-7.25"')).toBe(-7.25);
    expect(inLine('-7,25', true)).toBe(-7.25);
  });
});
