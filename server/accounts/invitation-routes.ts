import { route, type RouteDef } from '../http/route';
import { page, readListQuery } from '../http/list-query';
import {
  acceptInvitationSchema,
  clientInvitationSchema,
  createInvitationSchema,
  type AcceptInvitationBody,
  type ClientInvitationBody,
  type CreateInvitationBody,
} from '../../shared/schemas/accounts';
import type { AccountDeps } from './account-deps';
import { INVITATION_SORT, inviteMember, listPendingInvitations, revokeInvitation } from './member-invitations';
import { inviteClientAdministrator } from './client-invitation';
import { acceptInvitation, lookupInvitation } from './accept-invitation';

const ADMINS = ['lab-admin', 'manufacturer-admin'] as const;

export function invitationRoutes(deps: AccountDeps): RouteDef[] {
  return [
    route<CreateInvitationBody>({
      method: 'post',
      path: '/invitations',
      summary: 'Invite someone by e-mail to join the active organization with a role (single-use link, 7 days)',
      access: { kind: 'member', roles: ADMINS },
      bodySchema: createInvitationSchema,
      async handler(ctx) {
        return inviteMember(deps, ctx);
      },
    }),
    route({
      method: 'get',
      path: '/invitations',
      summary: 'Open invitations of the active organization (and those it sent into its clients’ organizations)',
      access: { kind: 'member', roles: ADMINS },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(INVITATION_SORT), filterable: ['search'], defaultSort: '-createdAt' });
        const { items, total } = await listPendingInvitations(deps.sequelize, ctx.organizationId!, q);
        return page(items, total, q);
      },
    }),
    route({
      method: 'delete',
      path: '/invitations/:id',
      summary: 'Revoke an open invitation',
      access: { kind: 'member', roles: ADMINS },
      async handler(ctx) {
        await revokeInvitation(ctx, ctx.params.id);
        ctx.status(204);
        return undefined;
      },
    }),
    route({
      method: 'get',
      path: '/invitations/lookup/:token',
      summary: 'Public: what an invitation link is for (organization, role, whether the address has an account)',
      access: { kind: 'public' },
      transaction: 'none',
      async handler(ctx) {
        return lookupInvitation(deps, ctx.params.token);
      },
    }),
    route<AcceptInvitationBody>({
      method: 'post',
      path: '/invitations/accept',
      summary: 'Public: accept an invitation (creates the account when needed, then signs it in)',
      access: { kind: 'public' },
      bodySchema: acceptInvitationSchema,
      transaction: 'none',
      async handler(ctx) {
        ctx.status(200);
        return acceptInvitation(deps, ctx.res, ctx.body);
      },
    }),
    route<ClientInvitationBody>({
      method: 'post',
      path: '/clients/:id/invitations',
      summary: 'Invite the first administrator of a manufacturer client (creates its organization when it has none)',
      access: { kind: 'member', roles: ['lab-admin'] },
      bodySchema: clientInvitationSchema,
      async handler(ctx) {
        return inviteClientAdministrator(deps, ctx, ctx.params.id);
      },
    }),
  ];
}
