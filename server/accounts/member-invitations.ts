/**
 * Administrators invite people into their own organization, list the invitations still open and
 * revoke them. The lab's view also shows the invitations it sent into its clients' organizations.
 */
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { Invitation, Membership, Organization } from '../db/models';
import type { RouteContext } from '../http/route';
import { conflict, notFound } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import { audit } from '../audit/audit';
import { ROLE_LABELS } from '../../shared/access/roles';
import type { CreateInvitationBody } from '../../shared/schemas/accounts';
import { invitationEmail } from '../../templates/email/invitation';
import type { AccountDeps } from './account-deps';
import { findUserByEmail } from './find-user-by-email';
import { requireRolesFit } from './organization-roles';
import { presentInvitation } from './invitation-presenter';
import { isUuid } from './is-uuid';
import { sendInvitation } from './send-invitation';

export async function inviteMember(deps: AccountDeps, ctx: RouteContext<CreateInvitationBody>) {
  const organization = (await Organization.findByPk(ctx.organizationId!))!;
  requireRolesFit(organization.kind, [ctx.body.role], '/role');
  const existing = await findUserByEmail(ctx.body.email, ctx.transaction);
  if (existing && (await Membership.count({ where: { organizationId: organization.id, userId: existing.id } })) > 0) {
    throw conflict('This person is already a member. Change their roles on the members list instead.', { code: 'already-member' });
  }
  const invitation = await sendInvitation(deps, ctx, {
    organizationId: organization.id,
    email: ctx.body.email,
    role: ctx.body.role,
    composeMail: (acceptUrl, expiresOn) =>
      invitationEmail({ kind: 'member', organizationName: organization.name, inviterName: ctx.principal!.displayName, roleLabel: ROLE_LABELS[ctx.body.role], acceptUrl, expiresOn }),
  });
  return presentInvitation(invitation, organization.name);
}

export const INVITATION_SORT: Record<string, string> = { createdAt: 'i.created_at', expiresAt: 'i.expires_at', email: 'lower(i.email)' };

/** Open member invitations of the organization, and those it sponsored into its clients' organizations. */
export async function listPendingInvitations(sequelize: Sequelize, organizationId: string, q: ListQuery) {
  const replacements: Record<string, unknown> = { org: organizationId, limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  let search = '';
  if (q.filter.search) {
    search = 'AND i.email ILIKE :like';
    replacements.like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
  }
  // Two index-friendly halves (organization_id, sponsor_organization_id) rather than one OR.
  const rows = await sequelize.query<{ id: string; organizationName: string; total: string }>(
    `SELECT i.id, o.name AS "organizationName", count(*) OVER () AS total FROM (
        SELECT * FROM invitations WHERE organization_id = :org
        UNION SELECT * FROM invitations WHERE sponsor_organization_id = :org) i
       JOIN organizations o ON o.id = i.organization_id
      WHERE i.kind = 'member' AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > now() ${search}
      ORDER BY ${INVITATION_SORT[q.sort]} ${q.direction}, i.id LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  const found = await Invitation.findAll({ where: { id: rows.map((r) => r.id) } });
  const byId = new Map(found.map((i) => [i.id, i]));
  return { items: rows.map((r) => presentInvitation(byId.get(r.id)!, r.organizationName)), total: rows.length ? Number(rows[0].total) : 0 };
}

/** Revoke an open invitation of the organization (or one it sponsored). Revoking twice is harmless. */
export async function revokeInvitation(ctx: RouteContext, id: string): Promise<void> {
  const invitation = isUuid(id)
    ? await Invitation.findOne({ where: { id, kind: 'member', [Op.or]: [{ organizationId: ctx.organizationId! }, { sponsorOrganizationId: ctx.organizationId! }] }, lock: ctx.transaction?.LOCK.UPDATE })
    : null;
  if (!invitation) throw notFound('The invitation');
  if (invitation.acceptedAt) throw conflict('This invitation has already been accepted; remove the member instead.', { code: 'invitation-accepted' });
  if (invitation.revokedAt) return;
  const before = presentInvitation(invitation);
  await invitation.update({ revokedAt: new Date() });
  await audit(ctx, { action: 'revoke', entity: 'invitation', entityId: invitation.id, before, after: presentInvitation(invitation) });
}
