/**
 * Formats an amount in a currency's minor unit for display, e.g. 1999 EUR cents → '€19.99'.
 *
 * The number of minor-unit digits is taken from ISO 4217 through Intl (EUR 2, JPY 0, KWD 3).
 * Note the payment API treats a few currencies differently from ISO 4217 (from memory: some it
 * calls zero-decimal, e.g. HUF and TWD for payouts); the page only displays, so ISO is used.
 *
 * @param amountMinor - integer amount in the minor unit.
 * @param currency - ISO 4217 code, any case.
 * @returns the localised string in English formatting.
 * @throws RangeError (from Intl) for an unknown currency code.
 * @example formatMinorAmount(1999, 'eur') === '€19.99'; formatMinorAmount(500, 'jpy') === '¥500'
 */
export function formatMinorAmount(amountMinor: number, currency: string): string {
  const format = new Intl.NumberFormat('en-GB', {
    style: 'currency',
    currency: currency.toUpperCase(),
  });
  const digits = format.resolvedOptions().maximumFractionDigits ?? 2;
  return format.format(amountMinor / 10 ** digits);
}
