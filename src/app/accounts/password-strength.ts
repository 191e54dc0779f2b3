import type { AbstractControl, ValidationErrors } from '@angular/forms';

/** The server's rule for new passwords (server/auth/password.ts): 12 to 200 characters, letters and a digit. */
export const PASSWORD_RULE_TEXT = 'At least 12 characters, with letters and at least one digit.';

/**
 * What is wrong with a new password, in a sentence, or null when it meets the rule above. The
 * server checks again; this only spares a round trip. Never throws.
 * @example passwordProblem('short1'); // 'Use at least 12 characters.'
 */
export function passwordProblem(password: string): string | null {
  if (password.length < 12) return 'Use at least 12 characters.';
  if (password.length > 200) return 'Use at most 200 characters.';
  if (!/[A-Za-z]/.test(password) || !/[0-9]/.test(password)) return 'Use letters and at least one digit.';
  return null;
}

/** Reactive-forms validator: { password: sentence } when the value breaks the rule. */
export function passwordStrength(control: AbstractControl): ValidationErrors | null {
  const problem = passwordProblem(String(control.value ?? ''));
  return problem ? { password: problem } : null;
}
