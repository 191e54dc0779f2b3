/**
 * Bench-automation API keys: "sck_" followed by 32 random bytes in base64url (43 characters, 256
 * bits). Only the SHA-256 of the whole key is stored, with a short prefix a person can recognise
 * in the list; the key itself is shown once, when it is made.
 */
import crypto from 'node:crypto';

export const API_KEY_PATTERN = /^sck_[A-Za-z0-9_-]{43}$/;
/** "sck_" and the first 8 characters of the secret part: enough to tell keys apart, useless to guess with. */
export const API_KEY_PREFIX_LENGTH = 12;

/** SHA-256 of the key, hex. A fast hash suits a 256-bit random secret (no dictionary to slow down). */
export function hashApiKey(key: string): string {
  return crypto.createHash('sha256').update(key, 'utf8').digest('hex');
}

/** A new key. Example: generateApiKey().key matches API_KEY_PATTERN; prefix === key.slice(0, 12). */
export function generateApiKey(): { key: string; prefix: string; keyHash: string } {
  const key = `sck_${crypto.randomBytes(32).toString('base64url')}`;
  return { key, prefix: key.slice(0, API_KEY_PREFIX_LENGTH), keyHash: hashApiKey(key) };
}
