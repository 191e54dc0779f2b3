import { randomBytes } from 'node:crypto';

const ALPHABET = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/**
 * A new object id in the API's style: a type prefix, '_', then random base-62 characters
 * (cus_, cs_test_, pi_, ch_, re_, evt_, prod_, price_, li_, pm_ …). Test-mode Checkout Session ids
 * carry `cs_test_` as in the real API (from memory).
 *
 * @param prefix - the type prefix without the trailing underscore, e.g. 'cus'.
 * @param length - number of random characters, default 24 (≈143 bits).
 * @returns e.g. 'cus_8fQ2kLx0aZ3mN5pR7tV9wY1b'.
 * @throws RangeError when `length` is not an integer from 8 to 64.
 * @example newObjectId('pi').startsWith('pi_') === true
 */
export function newObjectId(prefix: string, length = 24): string {
  if (!Number.isInteger(length) || length < 8 || length > 64) {
    throw new RangeError(`newObjectId: length must be an integer 8..64, got ${length}`);
  }
  const bytes = randomBytes(length);
  let suffix = '';
  // 248 = 4 × 62: rejecting bytes above it keeps every character equally likely.
  for (let index = 0; suffix.length < length; index++) {
    const byte = index < bytes.length ? bytes[index] : randomBytes(1)[0];
    if (byte < 248) suffix += ALPHABET[byte % 62];
  }
  return `${prefix}_${suffix}`;
}

/** Current Unix time in whole seconds, the unit of every `created` field. */
export function unixNow(): number {
  return Math.floor(Date.now() / 1000);
}
