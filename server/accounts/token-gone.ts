import { Problem } from '../http/problem';

/**
 * 410 Gone for a link that existed but can no longer be used (used, expired or revoked), with a
 * stable code the client can switch on. An unknown token is a plain 404 instead.
 */
export function tokenGone(detail: string, code: 'invitation-used' | 'invitation-expired' | 'invitation-revoked' | 'reset-used' | 'reset-expired'): Problem {
  return new Problem({ status: 410, code, title: 'Link no longer valid', detail });
}
