/**
 * Every invitation goes out the same way: a new single-use token (stored hashed) valid for seven
 * days, any earlier open invitation of the same address to the same place revoked (only the
 * newest link works), the e-mail enqueued in the same transaction, and an audit entry.
 */
import { Op } from 'sequelize';
import { Invitation, type AuditorGrant } from '../db/models';
import type { RouteContext } from '../http/route';
import { audit } from '../audit/audit';
import type { RenderedEmail } from '../../templates/email/layout';
import type { Role } from '../../shared/access/roles';
import type { AccountDeps } from './account-deps';
import { createSingleUseToken } from './single-use-token';

export const INVITATION_VALID_DAYS = 7;

export interface InvitationRequest {
  organizationId: string;
  /** The lab inviting into its client's organization, when that is not the caller's own. */
  sponsorOrganizationId?: string | null;
  email: string;
  /** A member invitation gives this role; an auditor invitation carries the grant instead. */
  role?: Role;
  grant?: AuditorGrant;
  /** The e-mail for this invitation, given its link and the link's last day (ISO date). */
  composeMail(acceptUrl: string, expiresOn: string): RenderedEmail;
}

export async function sendInvitation(deps: AccountDeps, ctx: RouteContext, request: InvitationRequest): Promise<Invitation> {
  const kind = request.grant ? 'auditor' : 'member';
  const expiresAt = new Date(Date.now() + INVITATION_VALID_DAYS * 86_400_000);
  await Invitation.update(
    { revokedAt: new Date() },
    {
      where: {
        organizationId: request.organizationId,
        kind,
        ...(request.grant ? { auditorGrantId: request.grant.id } : {}),
        email: { [Op.iLike]: request.email.replace(/[%_\\]/g, '\\$&') },
        acceptedAt: { [Op.is]: null },
        revokedAt: { [Op.is]: null },
      },
    },
  );
  const { token, tokenHash } = createSingleUseToken();
  const invitation = await Invitation.create({
    organizationId: request.organizationId,
    sponsorOrganizationId: request.sponsorOrganizationId ?? null,
    kind,
    email: request.email,
    role: request.role ?? null,
    auditorGrantId: request.grant?.id ?? null,
    tokenHash,
    invitedBy: ctx.principal?.userId ?? null,
    expiresAt,
  });
  const mail = request.composeMail(`${deps.publicUrl}/invitations/${token}`, expiresAt.toISOString().slice(0, 10));
  await deps.mail.enqueue(ctx.transaction, { to: request.email, ...mail });
  await audit(ctx, {
    action: 'invite',
    entity: 'invitation',
    entityId: invitation.id,
    after: { organizationId: request.organizationId, email: request.email, kind, role: request.role ?? null, auditorGrantId: request.grant?.id ?? null, expiresAt: expiresAt.toISOString() },
  });
  return invitation;
}
