/**
 * A lab administrator gives an outside auditor (an accreditation body's assessor, a client's
 * quality team) read-only access to the lab's issued reports: all of them, those of one client, or
 * those of one device, until a last day. The auditor accepts through an e-mailed invitation link
 * (server/accounts/accept-invitation.ts), which creates an account without memberships if needed.
 */
import { Op, type WhereOptions } from 'sequelize';
import { AuditorGrant, Client, Device, Invitation, Organization } from '../db/models';
import type { RouteContext } from '../http/route';
import { notFound, validationFailed } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import { audit } from '../audit/audit';
import type { CreateAuditorGrantBody } from '../../shared/schemas/accounts';
import { invitationEmail } from '../../templates/email/invitation';
import type { AccountDeps } from '../accounts/account-deps';
import { isUuid } from '../accounts/is-uuid';
import { sendInvitation } from '../accounts/send-invitation';
import { presentGrant, todayUtc } from './grant-presenter';

/** Longest grant: three years, the usual interval between full accreditation reassessments (common practice). */
const MAX_GRANT_DAYS = 3 * 366;

/** What the grant covers, in words for the e-mail; 422 when the scope and the ids do not agree. */
async function describeScope(body: CreateAuditorGrantBody): Promise<string> {
  const fail = (pointer: string, message: string) => validationFailed(`${pointer.slice(1)} ${message}.`, [{ pointer, message }]);
  if (body.scope !== 'client' && body.clientId) throw fail('/clientId', `must be left out when the scope is ${body.scope}`);
  if (body.scope !== 'device' && body.deviceId) throw fail('/deviceId', `must be left out when the scope is ${body.scope}`);
  if (body.scope === 'client') {
    const client = body.clientId ? await Client.findByPk(body.clientId) : null;
    if (!client) throw fail('/clientId', body.clientId ? 'does not name a client of this lab' : 'is required when the scope is client');
    return `the test reports it has issued to ${client.name}`;
  }
  if (body.scope === 'device') {
    const device = body.deviceId ? await Device.findByPk(body.deviceId) : null;
    if (!device) throw fail('/deviceId', body.deviceId ? 'does not name a device of this lab' : 'is required when the scope is device');
    return `the test reports of ${device.manufacturer} ${device.model} (serial number ${device.serialNumber})`;
  }
  return 'all the test reports it has issued';
}

export async function createGrant(deps: AccountDeps, ctx: RouteContext<CreateAuditorGrantBody>) {
  const body = ctx.body;
  const today = todayUtc();
  const latest = todayUtc(new Date(Date.now() + MAX_GRANT_DAYS * 86_400_000));
  if (body.expiresOn < today || body.expiresOn > latest) {
    throw validationFailed(`expiresOn must be from today (${today}) to ${latest}.`, [{ pointer: '/expiresOn', message: `must be from ${today} to ${latest}` }]);
  }
  const scopeText = await describeScope(body);
  const lab = (await Organization.findByPk(ctx.organizationId!))!;
  const grant = await AuditorGrant.create({
    organizationId: lab.id,
    email: body.email,
    scope: body.scope,
    clientId: body.clientId ?? null,
    deviceId: body.deviceId ?? null,
    expiresOn: body.expiresOn,
    note: body.note ?? null,
    grantedBy: ctx.principal!.userId,
  });
  await audit(ctx, { action: 'create', entity: 'auditor-grant', entityId: grant.id, after: presentGrant(grant) });
  await sendInvitation(deps, ctx, {
    organizationId: lab.id,
    email: body.email,
    grant,
    composeMail: (acceptUrl, expiresOn) =>
      invitationEmail({ kind: 'auditor', organizationName: lab.name, inviterName: ctx.principal!.displayName, scopeText, accessUntil: body.expiresOn, note: body.note ?? null, acceptUrl, expiresOn }),
  });
  return presentGrant(grant);
}

const STATUS_WHERE: Record<string, (today: string) => WhereOptions> = {
  revoked: () => ({ revokedAt: { [Op.ne]: null } }),
  expired: (today) => ({ revokedAt: { [Op.is]: null }, expiresOn: { [Op.lt]: today } }),
  pending: (today) => ({ revokedAt: { [Op.is]: null }, acceptedAt: { [Op.is]: null }, expiresOn: { [Op.gte]: today } }),
  active: (today) => ({ revokedAt: { [Op.is]: null }, acceptedAt: { [Op.ne]: null }, expiresOn: { [Op.gte]: today } }),
};
export const GRANT_STATUSES = Object.keys(STATUS_WHERE);

export async function listGrants(organizationId: string, q: ListQuery) {
  const status = q.filter.status ? STATUS_WHERE[q.filter.status](todayUtc()) : {};
  const { rows, count } = await AuditorGrant.findAndCountAll({
    where: { ...status, organizationId },
    order: [[q.sort, q.direction], ['id', 'ASC']],
    limit: q.pageSize,
    offset: (q.page - 1) * q.pageSize,
  });
  return { items: rows.map(presentGrant), total: count };
}

/** Revoke a grant: its reports disappear from the auditor's list at once, and an open link dies. */
export async function revokeGrant(ctx: RouteContext, id: string): Promise<void> {
  const grant = isUuid(id) ? await AuditorGrant.findOne({ where: { id, organizationId: ctx.organizationId! } }) : null;
  if (!grant) throw notFound('The auditor grant');
  if (grant.revokedAt) return;
  const before = presentGrant(grant);
  const now = new Date();
  await grant.update({ revokedAt: now });
  await Invitation.update({ revokedAt: now }, { where: { auditorGrantId: grant.id, acceptedAt: { [Op.is]: null }, revokedAt: { [Op.is]: null } } });
  await audit(ctx, { action: 'revoke', entity: 'auditor-grant', entityId: grant.id, before, after: presentGrant(grant) });
}
