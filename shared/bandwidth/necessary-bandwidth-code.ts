import { requireFinite } from '../units/number-guards';

const UNITS = [
  { letter: 'H', scale: 1 },
  { letter: 'K', scale: 1e3 },
  { letter: 'M', scale: 1e6 },
  { letter: 'G', scale: 1e9 },
] as const;

/**
 * The four-character necessary-bandwidth code of an emission designator: three significant
 * figures with the unit letter (H, K, M, G for Hz, kHz, MHz, GHz) in the decimal position.
 * Below 1 Hz the code is 'H' and three decimals (0.002 Hz → 'H002'). Values are rounded to
 * three significant figures, halves upward (180.5 kHz → '181K').
 *
 * Source: ITU RR Appendix 1 §1 and 47 CFR 2.202 (published): 400 Hz → '400H', 2.7 kHz →
 * '2K70', 12.5 kHz → '12K5', 180.5 kHz → '181K'.
 * Units: Hz. Domain: 0.001 Hz (after rounding) up to below 999.5 GHz.
 * Bad input: RangeError (TypeError for non-numbers) starting with the function name.
 *
 * @example formatNecessaryBandwidth(2700); // '2K70'
 */
export function formatNecessaryBandwidth(hz: number): string {
  const fn = 'formatNecessaryBandwidth';
  const value = requireFinite(fn, 'hz', hz);
  // toPrecision / toFixed round the exact binary value, ties to the larger digit.
  const rounded = Number(value.toPrecision(3));
  if (value > 0 && rounded < 1) {
    const thousandths = Math.round(Number(value.toFixed(3)) * 1000);
    if (thousandths < 1) throw new RangeError(`${fn}: ${value} Hz is below 0.001 Hz`);
    return `H${String(thousandths).padStart(3, '0')}`;
  }
  if (!(rounded >= 1)) {
    throw new RangeError(`${fn}: bandwidth must be greater than 0, got ${value}`);
  }
  const [mantissa, exponentText] = rounded.toExponential(2).split('e');
  const exponent = Number(exponentText);
  const unitIndex = Math.floor(exponent / 3);
  if (unitIndex >= UNITS.length) throw new RangeError(`${fn}: ${value} Hz is 1000 GHz or more`);
  const digits = mantissa.replace('.', '');
  const integerDigits = exponent - 3 * unitIndex + 1;
  return digits.slice(0, integerDigits) + UNITS[unitIndex].letter + digits.slice(integerDigits);
}

/**
 * Reads a four-character necessary-bandwidth code back to hertz: '2K70' → 2700, 'H002' → 0.002.
 * Exactly one unit letter (H, K, M, G) in the decimal position and three digits; the first
 * character is neither '0' nor K, M or G (RR Appendix 1 §1, published).
 * Bad input: RangeError starting with the function name saying what is wrong.
 *
 * @example parseNecessaryBandwidthCode('12K5'); // 12500
 */
export function parseNecessaryBandwidthCode(code: string): number {
  const fn = 'parseNecessaryBandwidthCode';
  if (typeof code !== 'string') throw new TypeError(`${fn}: code must be a string`);
  if (!/^[0-9HKMG]{4}$/.test(code)) {
    throw new RangeError(`${fn}: '${code}' must be 4 characters: 3 digits and one of H, K, M, G`);
  }
  const letterAt = code.search(/[HKMG]/);
  const letter = code[letterAt];
  if (letterAt < 0 || /[HKMG]/.test(code.slice(letterAt + 1))) {
    throw new RangeError(`${fn}: '${code}' must hold exactly one unit letter (H, K, M or G)`);
  }
  if (code[0] === '0' || (letterAt === 0 && letter !== 'H')) {
    throw new RangeError(`${fn}: '${code}' may not start with 0, K, M or G`);
  }
  const digits = code.slice(0, letterAt) + code.slice(letterAt + 1);
  const unit = UNITS.find((u) => u.letter === letter)!;
  // Integer arithmetic then one division keeps values such as 5G65 exact.
  const value = (Number(digits) * unit.scale) / 10 ** (3 - letterAt);
  if (!(value > 0)) throw new RangeError(`${fn}: '${code}' is a zero bandwidth`);
  return value;
}
