import { CURRENCY_MINOR_UNITS, MAX_AMOUNT_MINOR, type CreditCurrency } from '../../../shared/schemas/billing';

/**
 * A price typed in major units ("180", "180.5", "1,800.00") as whole minor units of `currency`
 * (ISO 4217 minor unit from CURRENCY_MINOR_UNITS). Answers null for anything that is not a
 * positive amount with at most the currency's decimals, or above MAX_AMOUNT_MINOR. Never throws.
 * String arithmetic on the digits, so no binary fraction creeps in.
 * @example toMinorUnits('180.50', 'GBP') // 18050
 * @example toMinorUnits('1.5', 'JPY') // null
 */
export function toMinorUnits(text: string, currency: CreditCurrency): number | null {
  const exponent = CURRENCY_MINOR_UNITS[currency];
  const match = /^(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d+))?$/.exec(text.trim());
  if (!match || exponent === undefined) return null;
  const fraction = match[2] ?? '';
  if (fraction.length > exponent) return null;
  const minor = Number(match[1].replace(/,/g, '') + fraction.padEnd(exponent, '0'));
  return Number.isSafeInteger(minor) && minor >= 1 && minor <= MAX_AMOUNT_MINOR ? minor : null;
}

/**
 * Whole minor units shown for editing in major units, without grouping: the inverse of toMinorUnits.
 * @example toMajorText(18050, 'GBP') // '180.50'
 */
export function toMajorText(minor: number, currency: CreditCurrency): string {
  const exponent = CURRENCY_MINOR_UNITS[currency] ?? 2;
  const digits = String(Math.max(0, Math.trunc(minor))).padStart(exponent + 1, '0');
  return exponent ? `${digits.slice(0, -exponent)}.${digits.slice(-exponent)}` : digits;
}
