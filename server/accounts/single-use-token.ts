/**
 * Single-use tokens for e-mailed links (invitations, password resets): 32 random bytes in
 * base64url (256 bits, so guessing is hopeless), stored only as their SHA-256, so the database
 * alone never lets anyone use a link.
 */
import crypto from 'node:crypto';

/** The shape every token has; anything else is refused before a lookup. */
export const SINGLE_USE_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

/** SHA-256 of the token, hex. */
export function hashSingleUseToken(token: string): string {
  return crypto.createHash('sha256').update(token, 'utf8').digest('hex');
}

/** A fresh token and the hash to store. Example: createSingleUseToken().token.length === 43. */
export function createSingleUseToken(): { token: string; tokenHash: string } {
  const token = crypto.randomBytes(32).toString('base64url');
  return { token, tokenHash: hashSingleUseToken(token) };
}
