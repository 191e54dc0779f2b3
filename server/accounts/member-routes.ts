import { route, type RouteDef } from '../http/route';
import { page, readListQuery } from '../http/list-query';
import { badRequest } from '../http/problem';
import { ROLES } from '../../shared/access/roles';
import { setRolesSchema, type SetRolesBody } from '../../shared/schemas/accounts';
import type { AccountDeps } from './account-deps';
import { listMembers, MEMBER_SORT, removeMember, setMemberRoles } from './members';

const ADMINS = ['lab-admin', 'manufacturer-admin'] as const;

/** Members of the active organization: everyone may see who is in it; administrators change it. */
export function memberRoutes(deps: AccountDeps): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/members',
      summary: 'Members of the active organization with their roles, paginated (search, role)',
      access: { kind: 'member', roles: ROLES },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(MEMBER_SORT), filterable: ['search', 'role'], defaultSort: 'name' });
        if (q.filter.role && !(ROLES as readonly string[]).includes(q.filter.role)) throw badRequest(`Unknown role "${q.filter.role}".`);
        const { items, total } = await listMembers(deps.sequelize, ctx.organizationId!, q);
        return page(items, total, q);
      },
    }),
    route<SetRolesBody>({
      method: 'put',
      path: '/members/:userId/roles',
      summary: 'Replace a member’s roles (the last administrator keeps theirs)',
      access: { kind: 'member', roles: ADMINS },
      bodySchema: setRolesSchema,
      async handler(ctx) {
        return setMemberRoles(ctx, ctx.params.userId, ctx.body.roles);
      },
    }),
    route({
      method: 'delete',
      path: '/members/:userId',
      summary: 'Remove a member from the organization (not the last administrator)',
      access: { kind: 'member', roles: ADMINS },
      async handler(ctx) {
        await removeMember(ctx, ctx.params.userId);
        ctx.status(204);
        return undefined;
      },
    }),
  ];
}
