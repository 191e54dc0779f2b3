import type { AuditorGrant } from '../db/models';

/** Today's date in UTC, ISO (grants run to the end of their last day, UTC). */
export function todayUtc(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** pending: not accepted yet; active: accepted and not past its last day; expired; revoked. */
export function grantStatus(g: AuditorGrant, today = todayUtc()): 'pending' | 'active' | 'expired' | 'revoked' {
  if (g.revokedAt) return 'revoked';
  if (g.expiresOn < today) return 'expired';
  return g.acceptedAt ? 'active' : 'pending';
}

export function presentGrant(g: AuditorGrant) {
  return {
    id: g.id,
    email: g.email,
    scope: g.scope,
    clientId: g.clientId,
    deviceId: g.deviceId,
    expiresOn: g.expiresOn,
    note: g.note,
    status: grantStatus(g),
    grantedBy: g.grantedBy,
    acceptedAt: g.acceptedAt?.toISOString() ?? null,
    revokedAt: g.revokedAt?.toISOString() ?? null,
    createdAt: g.createdAt.toISOString(),
  };
}
