/**
 * The members of the active organization and their roles. Memberships have no row-level policy
 * (sign-in reads them across organizations), so every query here names the organization itself.
 * An organization always keeps at least one administrator: the administrators' rows are locked
 * before any change, so two administrators demoting each other at once cannot both succeed.
 */
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { Membership, Organization } from '../db/models';
import type { RouteContext } from '../http/route';
import { conflict, notFound } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import { audit } from '../audit/audit';
import type { Role } from '../../shared/access/roles';
import { adminRoleOf, requireRolesFit } from './organization-roles';
import { isUuid } from './is-uuid';

export const MEMBER_SORT: Record<string, string> = { name: 'lower(u.display_name)', email: 'lower(u.email)', memberSince: 'min(m.created_at)' };

export interface MemberRow {
  userId: string;
  name: string;
  email: string;
  roles: Role[];
  memberSince: string;
}

export async function listMembers(sequelize: Sequelize, organizationId: string, q: ListQuery): Promise<{ items: MemberRow[]; total: number }> {
  const replacements: Record<string, unknown> = { org: organizationId, limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  const where: string[] = ['m.organization_id = :org'];
  if (q.filter.search) {
    where.push('(u.display_name ILIKE :like OR u.email ILIKE :like)');
    replacements.like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
  }
  const having = q.filter.role ? 'HAVING bool_or(m.role = :role)' : '';
  if (q.filter.role) replacements.role = q.filter.role;
  const rows = await sequelize.query<MemberRow & { memberSince: Date; total: string }>(
    `SELECT u.id AS "userId", u.display_name AS name, u.email, array_agg(m.role ORDER BY m.role) AS roles,
            min(m.created_at) AS "memberSince", count(*) OVER () AS total
       FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE ${where.join(' AND ')} GROUP BY u.id ${having}
      ORDER BY ${MEMBER_SORT[q.sort]} ${q.direction}, u.id LIMIT :limit OFFSET :offset`,
    { replacements, type: QueryTypes.SELECT },
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    items: rows.map(({ total: _t, memberSince, ...r }) => ({ ...r, memberSince: new Date(memberSince).toISOString() })),
  };
}

/** Lock the organization's administrator rows and the member's rows; 404 when not a member. */
async function lockMember(ctx: RouteContext, userId: string) {
  const organization = (await Organization.findByPk(ctx.organizationId!))!;
  const admin = adminRoleOf(organization.kind);
  const lock = ctx.transaction!.LOCK.UPDATE;
  const admins = await Membership.findAll({ where: { organizationId: organization.id, role: admin }, lock, order: [['id', 'ASC']] });
  const rows = isUuid(userId) ? await Membership.findAll({ where: { organizationId: organization.id, userId }, lock, order: [['id', 'ASC']] }) : [];
  if (rows.length === 0) throw notFound('The member');
  const isOnlyAdmin = admins.length === 1 && admins[0].userId === userId;
  return { organization, admin, rows, isOnlyAdmin };
}

const LAST_ADMIN = (role: Role) =>
  conflict(`This is the organization's only ${role === 'lab-admin' ? 'lab' : 'manufacturer'} administrator. Give someone else that role first.`, { code: 'last-admin' });

/** Replace the member's roles with `roles` (lab roles in labs, manufacturer roles elsewhere). */
export async function setMemberRoles(ctx: RouteContext, userId: string, roles: Role[]) {
  const { organization, admin, rows, isOnlyAdmin } = await lockMember(ctx, userId);
  requireRolesFit(organization.kind, roles, '/roles');
  if (isOnlyAdmin && !roles.includes(admin)) throw LAST_ADMIN(admin);
  const before = rows.map((r) => r.role).sort();
  await Membership.destroy({ where: { organizationId: organization.id, userId, role: { [Op.notIn]: roles } } });
  for (const role of roles.filter((r) => !before.includes(r))) await Membership.create({ organizationId: organization.id, userId, role });
  const after = [...roles].sort();
  await audit(ctx, { action: 'member-roles', entity: 'membership', entityId: userId, before: { roles: before }, after: { roles: after } });
  return { userId, roles: after };
}

/** Remove the member from the organization (their account stays, with its other memberships). */
export async function removeMember(ctx: RouteContext, userId: string): Promise<void> {
  const { organization, admin, rows, isOnlyAdmin } = await lockMember(ctx, userId);
  if (isOnlyAdmin) throw LAST_ADMIN(admin);
  await Membership.destroy({ where: { organizationId: organization.id, userId } });
  await audit(ctx, { action: 'member-remove', entity: 'membership', entityId: userId, before: { roles: rows.map((r) => r.role).sort() } });
}
