import type { Invitation } from '../db/models';

/** Whether an invitation can still be accepted, from its stored times. */
export function invitationStatus(i: Invitation, now = new Date()): 'pending' | 'accepted' | 'revoked' | 'expired' {
  if (i.acceptedAt) return 'accepted';
  if (i.revokedAt) return 'revoked';
  return i.expiresAt.getTime() <= now.getTime() ? 'expired' : 'pending';
}

/** An invitation as the API shows it to administrators: never the token, which only the invitee has. */
export function presentInvitation(i: Invitation, organizationName?: string) {
  return {
    id: i.id,
    organizationId: i.organizationId,
    ...(organizationName === undefined ? {} : { organizationName }),
    sponsorOrganizationId: i.sponsorOrganizationId,
    email: i.email,
    role: i.role,
    status: invitationStatus(i),
    invitedBy: i.invitedBy,
    expiresAt: i.expiresAt.toISOString(),
    createdAt: i.createdAt.toISOString(),
  };
}
