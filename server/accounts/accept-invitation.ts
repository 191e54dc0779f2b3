/**
 * The public side of an invitation link: what it is for (lookup) and accepting it. The caller has
 * no organization yet and the token names one, so both run in the system scope
 * (server/tenancy/tenant-transaction.ts asSystem; listed in DEVELOPERS.md). The token itself is the
 * authority: 256 random bits, stored hashed, single-use, seven days.
 */
import type { Response } from 'express';
import type { Transaction } from 'sequelize';
import { AuditEntry, AuditorGrant, Invitation, Membership, Organization, User } from '../db/models';
import { notFound, validationFailed, type FieldError } from '../http/problem';
import { asSystem } from '../tenancy/tenant-transaction';
import { hashPassword, passwordProblems } from '../auth/password';
import { openSession } from '../auth/routes';
import { ROLE_LABELS } from '../../shared/access/roles';
import type { AcceptInvitationBody } from '../../shared/schemas/accounts';
import type { AccountDeps } from './account-deps';
import { findUserByEmail } from './find-user-by-email';
import { invitationStatus } from './invitation-presenter';
import { hashSingleUseToken, SINGLE_USE_TOKEN_PATTERN } from './single-use-token';
import { tokenGone } from './token-gone';

const UNKNOWN = 'This invitation link';

/** The invitation named by the token, refused with 404 or 410 unless it can still be accepted. */
async function openInvitation(token: string, transaction: Transaction, options: { lock: boolean }) {
  if (!SINGLE_USE_TOKEN_PATTERN.test(token)) throw notFound(UNKNOWN);
  const invitation = await Invitation.findOne({ where: { tokenHash: hashSingleUseToken(token) }, transaction, lock: options.lock ? transaction.LOCK.UPDATE : undefined });
  if (!invitation) throw notFound(UNKNOWN);
  const grant = invitation.auditorGrantId ? await AuditorGrant.findByPk(invitation.auditorGrantId, { transaction, lock: options.lock ? transaction.LOCK.UPDATE : undefined }) : null;
  const status = invitationStatus(invitation);
  if (status === 'accepted') throw tokenGone('This invitation has already been used. Sign in, or ask for a new invitation.', 'invitation-used');
  if (status === 'revoked' || grant?.revokedAt) throw tokenGone('This invitation was withdrawn by the organization that sent it.', 'invitation-revoked');
  if (status === 'expired') throw tokenGone('This invitation has expired. Ask the organization that sent it for a new one.', 'invitation-expired');
  const organization = (await Organization.findByPk(invitation.organizationId, { transaction }))!;
  return { invitation, grant, organization };
}

/** What the link is for, so the acceptance screen can ask for a name and password only when needed. */
export async function lookupInvitation(deps: AccountDeps, token: string) {
  return asSystem(deps.sequelize, async (transaction) => {
    const { invitation, grant, organization } = await openInvitation(token, transaction, { lock: false });
    return {
      kind: invitation.kind,
      organizationName: organization.name,
      organizationKind: organization.kind,
      role: invitation.role,
      roleLabel: invitation.role ? ROLE_LABELS[invitation.role] : null,
      email: invitation.email,
      accountExists: (await findUserByEmail(invitation.email, transaction)) !== null,
      expiresAt: invitation.expiresAt.toISOString(),
      grant: grant && { scope: grant.scope, expiresOn: grant.expiresOn },
    };
  });
}

/** Create the account when needed (name and password then required), then the membership or the grant. */
async function accountFor(email: string, body: AcceptInvitationBody, transaction: Transaction): Promise<{ user: User; created: boolean }> {
  const existing = await findUserByEmail(email, transaction);
  // An existing account keeps its name and password: the link adds access, it never changes an account.
  if (existing) return { user: existing, created: false };
  const errors: FieldError[] = [];
  if (!body.name) errors.push({ pointer: '/name', message: 'is required to create your account' });
  if (!body.password) errors.push({ pointer: '/password', message: 'is required to create your account' });
  const weak = body.password ? passwordProblems(body.password) : null;
  if (weak) errors.push({ pointer: '/password', message: weak });
  if (errors.length) throw validationFailed(`To create your account: ${errors.map((e) => `${e.pointer.slice(1)} ${e.message}`).join('; ')}.`, errors);
  const user = await User.create({ email, displayName: body.name!.trim(), passwordHash: await hashPassword(body.password!) }, { transaction });
  return { user, created: true };
}

export async function acceptInvitation(deps: AccountDeps, res: Response, body: AcceptInvitationBody) {
  const outcome = await asSystem(deps.sequelize, async (transaction) => {
    const { invitation, grant, organization } = await openInvitation(body.token, transaction, { lock: true });
    const { user, created } = await accountFor(invitation.email, body, transaction);
    const now = new Date();
    if (invitation.kind === 'member') {
      await Membership.findOrCreate({ where: { organizationId: organization.id, userId: user.id, role: invitation.role! }, transaction });
    } else {
      await grant!.update({ auditorUserId: user.id, acceptedAt: now }, { transaction });
    }
    await invitation.update({ acceptedAt: now, acceptedBy: user.id }, { transaction });
    await AuditEntry.create(
      { organizationId: organization.id, userId: user.id, action: 'invitation-accept', entity: 'invitation', entityId: invitation.id, after: { kind: invitation.kind, role: invitation.role, auditorGrantId: invitation.auditorGrantId, accountCreated: created } },
      { transaction },
    );
    return { userId: user.id, created, organizationId: organization.id, kind: invitation.kind };
  });
  const result = { accountCreated: outcome.created, kind: outcome.kind, organizationId: outcome.organizationId };
  // A new account is signed in at once; an existing one signs in as usual (the link is not a password).
  return outcome.created ? { ...result, ...(await openSession(res, outcome.userId, deps)) } : result;
}
