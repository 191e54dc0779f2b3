import { FormControl } from '@angular/forms';
import { passwordProblem, passwordStrength } from './password-strength';

// The rule is the product's own (common practice: length over composition, NIST SP 800-63B §5.1.1.2
// asks for at least 8; we ask 12 and one digit); each row sits on one side of a boundary.
describe('passwordProblem', () => {
  it.each([
    ['', 'Use at least 12 characters.'],
    ['abcdefghij1', 'Use at least 12 characters.'],
    ['abcdefghijk1', null],
    ['abcdefghijkl', 'Use letters and at least one digit.'],
    ['123456789012', 'Use letters and at least one digit.'],
    ['a1'.repeat(100), null],
    ['a1'.repeat(100) + 'x', 'Use at most 200 characters.'],
  ])('%j → %j', (password, expected) => {
    expect(passwordProblem(password)).toBe(expected);
  });

  it('works as a form validator', () => {
    expect(new FormControl('short', passwordStrength).errors).toEqual({ password: 'Use at least 12 characters.' });
    expect(new FormControl('long enough 1', passwordStrength).errors).toBeNull();
  });
});
