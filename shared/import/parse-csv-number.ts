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

/** 10^0 ... 10^22: every one exactly a double. */
const EXACT_POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));
const ZERO = 48;
const NINE = 57;

/**
 * parseCsvNumber of `text.slice(start, end)`, for the common field (a plain decimal, no spaces or
 * quotes) without making the slice: the digits are read as an integer m and a power of ten k,
 * and while m < 2^53 and |k| <= 22 both are exact doubles, so one multiplication or division
 * rounds correctly and gives exactly what Number() gives (Clinger's fast path, W. D. Clinger,
 * "How to read floating point numbers accurately", PLDI 1990). Any other field goes to
 * parseCsvNumber, unchanged.
 */
export function parseCsvNumberAt(text: string, start: number, end: number, decimalComma: boolean): number {
  let i = start;
  let negative = false;
  let c = text.charCodeAt(i);
  if (i < end && (c === 43 /* + */ || c === 45) /* - */) {
    negative = c === 45;
    c = text.charCodeAt(++i);
  }
  let mantissa = 0;
  let digits = 0; // significant digits read into the mantissa
  let scale = 0; // digits after the point
  let integerDigits = 0;
  for (; i < end && (c = text.charCodeAt(i)) >= ZERO && c <= NINE; i++, integerDigits++) {
    if (mantissa !== 0 || c !== ZERO) digits++;
    mantissa = mantissa * 10 + (c - ZERO);
  }
  let fractionDigits = 0;
  if (i < end && text.charCodeAt(i) === 46 /* . */) {
    for (i++; i < end && (c = text.charCodeAt(i)) >= ZERO && c <= NINE; i++, fractionDigits++) {
      if (mantissa !== 0 || c !== ZERO) digits++;
      mantissa = mantissa * 10 + (c - ZERO);
    }
    scale = fractionDigits;
  }
  let exponent = 0;
  if (i < end && (integerDigits > 0 || fractionDigits > 0) && (text.charCodeAt(i) | 32) === 101 /* e */) {
    i++;
    let exponentNegative = false;
    c = text.charCodeAt(i);
    if (i < end && (c === 43 || c === 45)) {
      exponentNegative = c === 45;
      i++;
    }
    const exponentStart = i;
    for (; i < end && (c = text.charCodeAt(i)) >= ZERO && c <= NINE && exponent < 1e6; i++) exponent = exponent * 10 + (c - ZERO);
    if (i === exponentStart) i = -1; // "1e" is not a number: the general path says so
    if (exponentNegative) exponent = -exponent;
  }
  const power = exponent - scale;
  if (i !== end || (integerDigits === 0 && fractionDigits === 0) || digits > 15 || power > 22 || power < -22) {
    return parseCsvNumber(text.slice(start, end), decimalComma);
  }
  const magnitude = power >= 0 ? mantissa * EXACT_POWERS_OF_TEN[power] : mantissa / EXACT_POWERS_OF_TEN[-power];
  return negative ? -magnitude : magnitude;
}
