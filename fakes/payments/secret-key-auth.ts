import { createHash, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { authenticationFailed } from './api-error';

/**
 * Requires the secret key on every request, as the API does: `Authorization: Bearer <key>` (what
 * the SDK sends) or HTTP Basic with the key as user name and an empty password (curl's
 * `-u key:`). A missing or wrong key answers 401, which the SDK raises as
 * StripeAuthenticationError.
 *
 * @param secretKey - the one accepted key.
 * @returns Express middleware.
 * @example app.use('/v1', secretKeyAuth('sk_test_local'))
 */
export function secretKeyAuth(secretKey: string): RequestHandler {
  const expected = digest(secretKey);
  return (request, _response, next) => {
    const presented = presentedKey(request.get('authorization'));
    // Compare digests in constant time so the check does not leak how much of a key matched.
    if (presented === null || !timingSafeEqual(digest(presented), expected)) {
      next(authenticationFailed(presented));
      return;
    }
    next();
  };
}

function presentedKey(header: string | undefined): string | null {
  if (!header) return null;
  const [scheme, value = ''] = header.split(/\s+/, 2);
  if (scheme.toLowerCase() === 'bearer') return value || null;
  if (scheme.toLowerCase() === 'basic') {
    const decoded = Buffer.from(value, 'base64').toString('utf8');
    return decoded.split(':')[0] || null;
  }
  return null;
}

function digest(text: string): Buffer {
  return createHash('sha256').update(text).digest();
}
