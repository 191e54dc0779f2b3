/**
 * Prints numbers for reports: fixed decimals, a true minus sign (U+2212, present in the embedded
 * font) and no "-0". Used for table cells and axis tick labels alike so both read the same.
 */

/**
 * `value` with `decimals` digits after the point; `signed` adds "+" to positive values (margins).
 * Non-finite values print as an em dash. Decimals outside 0..10 throw a RangeError.
 * @example formatNumber(-3.456, 2) // '\u22123.46'
 * @example formatNumber(6.3, 1, { signed: true }) // '+6.3'
 */
export function formatNumber(
  value: number,
  decimals: number,
  options: { signed?: boolean } = {},
): string {
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 10) {
    throw new RangeError(`formatNumber: decimals must be a whole number 0..10, got ${decimals}`);
  }
  if (!Number.isFinite(value)) return '\u2014';
  const text = Math.abs(value).toFixed(decimals);
  const isZero = Number(text) === 0;
  if (value < 0 && !isZero) return `\u2212${text}`;
  return options.signed && !isZero ? `+${text}` : text;
}

/**
 * Decimals that suit a measured value in a report: 2 below 100, 1 below 1000, else 0
 * (common practice: about four significant figures for readings with dB-level uncertainty).
 * @example defaultDecimals(46.31) // 2
 */
export function defaultDecimals(value: number): number {
  const magnitude = Math.abs(value);
  return magnitude < 100 ? 2 : magnitude < 1000 ? 1 : 0;
}
