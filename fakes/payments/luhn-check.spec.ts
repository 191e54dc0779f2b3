import { isLuhnValid } from './luhn-check';

describe('isLuhnValid', () => {
  it.each([
    // Worked example of the Luhn formula (ISO/IEC 7812-1 Annex B; the same number is the usual
    // textbook example): check digit 3 makes 7992739871x valid.
    ['79927398713', true],
    ['79927398710', false],
    // Published test card numbers (payment provider's testing docs, from memory) are Luhn-valid.
    ['4242424242424242', true],
    ['5555555555554444', true],
    ['378282246310005', true],
    ['4000000000000002', true],
    // One digit changed breaks the check (the Luhn code detects every single-digit error).
    ['4242424242424241', false],
    ['5555555555554445', false],
  ])('%s → %s', (digits, valid) => {
    expect(isLuhnValid(digits)).toBe(valid);
  });

  it('rejects empty and non-digit input', () => {
    expect(isLuhnValid('')).toBe(false);
    expect(isLuhnValid('4242 4242 4242 4242')).toBe(false);
    expect(isLuhnValid('42a2')).toBe(false);
  });
});
