const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/**
 * Parses one CSV field as a finite decimal number, strictly: no hex, no `Infinity`/`NaN`, no
 * empty field, surrounding spaces and double quotes allowed. With `decimalComma` (files that use
 * `;` or tab between fields, as spreadsheets in many locales write them) a single `,` is read as
 * the decimal point.
 *
 * @returns the number, or NaN when the field is not a number (the caller names the line/column).
 * @example parseCsvNumber(' 1.5e3 ', false) // 1500
 * @example parseCsvNumber('-7,25', true)    // -7.25
 * @example parseCsvNumber('0x10', false)    // NaN
 */
export function parseCsvNumber(field: string, decimalComma: boolean): number {
  // The usual field, a plain decimal without spaces or quotes, skips the trimming below.
  if (!decimalComma && DECIMAL.test(field)) {
    const value = Number(field);
    return Number.isFinite(value) ? value : NaN;
  }
  let text = field.trim();
  if (text.length >= 2 && text[0] === '"' && text[text.length - 1] === '"') {
    text = text.slice(1, -1).trim();
  }
  if (decimalComma && !text.includes('.')) text = text.replace(',', '.');
  if (!DECIMAL.test(text)) return NaN;
  const value = Number(text);
  return Number.isFinite(value) ? value : NaN;
}
