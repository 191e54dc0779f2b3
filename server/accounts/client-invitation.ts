/**
 * A lab brings a manufacturer client onto Sidecheck: when the client has no organization yet, one
 * is made for it (linked by clients.client_organization_id, so reports issued from now on reach it)
 * and its first manufacturer administrator is invited. Once that organization has members of its
 * own, the lab cannot add people to it any more: its administrators invite their colleagues.
 *
 * The invitation row belongs to the manufacturer's organization and names the lab as sponsor,
 * which the invitations row-level policy admits, so all of this is one tenant transaction of the lab.
 */
import { Client, Membership, Organization } from '../db/models';
import type { RouteContext } from '../http/route';
import { conflict, notFound } from '../http/problem';
import { audit } from '../audit/audit';
import { ROLE_LABELS } from '../../shared/access/roles';
import type { ClientInvitationBody } from '../../shared/schemas/accounts';
import { invitationEmail } from '../../templates/email/invitation';
import type { AccountDeps } from './account-deps';
import { presentInvitation } from './invitation-presenter';
import { uniqueOrganizationCode } from './organization-code';
import { isUuid } from './is-uuid';
import { sendInvitation } from './send-invitation';

async function clientOrganization(ctx: RouteContext, client: Client): Promise<Organization> {
  if (client.clientOrganizationId) {
    const existing = (await Organization.findByPk(client.clientOrganizationId))!;
    if ((await Membership.count({ where: { organizationId: existing.id } })) > 0) {
      throw conflict(`${existing.name} already has its own administrators on Sidecheck; ask them to invite their colleagues.`, { code: 'client-has-members' });
    }
    return existing;
  }
  const created = await Organization.create({
    kind: 'manufacturer',
    name: client.name,
    code: await uniqueOrganizationCode(client.name, ctx.transaction),
    addressLines: client.addressLines,
    email: client.contactEmail,
    phone: null,
    accreditation: null,
  });
  const before = { clientOrganizationId: client.clientOrganizationId };
  await client.update({ clientOrganizationId: created.id });
  await audit(ctx, { action: 'client-organization-create', entity: 'client', entityId: client.id, before, after: { clientOrganizationId: created.id, name: created.name, code: created.code } });
  return created;
}

export async function inviteClientAdministrator(deps: AccountDeps, ctx: RouteContext<ClientInvitationBody>, clientId: string) {
  const client = isUuid(clientId) ? await Client.findByPk(clientId) : null;
  if (!client) throw notFound('The client');
  const organization = await clientOrganization(ctx, client);
  const lab = (await Organization.findByPk(ctx.organizationId!))!;
  const email = ctx.body?.email ?? client.contactEmail;
  const invitation = await sendInvitation(deps, ctx, {
    organizationId: organization.id,
    sponsorOrganizationId: lab.id,
    email,
    role: 'manufacturer-admin',
    composeMail: (acceptUrl, expiresOn) =>
      invitationEmail({
        kind: 'member',
        organizationName: organization.name,
        inviterName: `${ctx.principal!.displayName} of ${lab.name}`,
        roleLabel: ROLE_LABELS['manufacturer-admin'],
        acceptUrl,
        expiresOn,
      }),
  });
  return presentInvitation(invitation, organization.name);
}
