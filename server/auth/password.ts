import { runHeavy } from '../workers/heavy-pool';

/**
 * Argon2id with the library's defaults (m = 19 MiB, t = 2, p = 1: OWASP's minimum recommendation),
 * in a worker thread of lower priority (server/workers/heavy-work.ts).
 */
export function hashPassword(password: string): Promise<string> {
  return runHeavy<string>({ kind: 'hash-password', password });
}

/** Whether `password` matches; false for no hash or a malformed one (a failed sign-in, never a 500). */
export async function verifyPassword(passwordHash: string | null, password: string): Promise<boolean> {
  if (!passwordHash) return false;
  return runHeavy<boolean>({ kind: 'verify-password', hash: passwordHash, password });
}

/** A fixed hash to verify against when the account does not exist, so timing does not reveal it. */
export const DUMMY_HASH = '$argon2id$v=19$m=19456,t=2,p=1$s1uj0XaksuOJcunXmUELPw$8GhhEVJL2qP7/ZcUxaqqfG/AUi65i5qYRNNnuzeu1ds';

export function passwordProblems(password: string): string | null {
  if (password.length < 12) return 'Use at least 12 characters.';
  if (password.length > 200) return 'Use at most 200 characters.';
  if (!/[A-Za-z]/.test(password) || !/[0-9]/.test(password)) return 'Use letters and at least one digit.';
  return null;
}
