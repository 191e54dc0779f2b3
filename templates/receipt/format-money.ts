/**
 * Prints an amount held in minor units (pence, cents, yen) for receipts and e-mails: the ISO 4217
 * code, a space, the major units with thousands separators and the currency's minor-unit decimals.
 */
import { CURRENCY_MINOR_UNITS, type CreditCurrency } from '../../shared/schemas/billing';

/**
 * `amountMinor / 10^e` in the currency `currency`, where e is its ISO 4217 minor unit.
 * Amounts must be whole, non-negative minor units; anything else, or a currency outside
 * CURRENCY_MINOR_UNITS, throws a RangeError.
 * @example formatMoney(290000, 'GBP') // 'GBP 2,900.00'
 * @example formatMoney(1200, 'JPY') // 'JPY 1,200'
 */
export function formatMoney(amountMinor: number, currency: string): string {
  const exponent = CURRENCY_MINOR_UNITS[currency as CreditCurrency];
  if (exponent === undefined) throw new RangeError(`formatMoney: unknown currency "${currency}"`);
  if (!Number.isSafeInteger(amountMinor) || amountMinor < 0) {
    throw new RangeError(`formatMoney: amount must be whole minor units >= 0, got ${amountMinor}`);
  }
  // Integer arithmetic on the digits: no binary fractions, so 0.1 + 0.2 cannot creep in.
  const digits = String(amountMinor).padStart(exponent + 1, '0');
  const major = digits.slice(0, digits.length - exponent);
  const minor = digits.slice(digits.length - exponent);
  const grouped = major.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${currency} ${grouped}${exponent > 0 ? `.${minor}` : ''}`;
}
