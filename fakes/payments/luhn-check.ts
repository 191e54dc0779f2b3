/**
 * Luhn (mod 10) check digit test, ISO/IEC 7812-1 Annex B: from the rightmost digit, double every
 * second digit, subtract 9 from results above 9, sum everything; valid when the sum ≡ 0 (mod 10).
 *
 * @param digits - the card number, digits only.
 * @returns true when the check digit is right; false for empty or non-digit input.
 * @example isLuhnValid('4242424242424242') === true; isLuhnValid('4242424242424241') === false
 */
export function isLuhnValid(digits: string): boolean {
  if (!/^[0-9]+$/.test(digits)) return false;
  let sum = 0;
  for (let offset = 0; offset < digits.length; offset++) {
    let digit = Number(digits[digits.length - 1 - offset]);
    if (offset % 2 === 1) {
      digit *= 2;
      if (digit > 9) digit -= 9;
    }
    sum += digit;
  }
  return sum % 10 === 0;
}
