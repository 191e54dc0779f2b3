import { Organization } from '../db/models';
import { route, type RouteDef } from '../http/route';
import { notFound } from '../http/problem';
import { audit } from '../audit/audit';
import { mailSettingsSchema, organizationDetailsSchema, type MailSettingsBody, type OrganizationDetailsBody } from '../../shared/schemas/organization';
import { ROLES } from '../../shared/access/roles';

/** The organization's own record; the code is fixed, since issued report numbers carry it. */
export function presentOrganization(o: Organization) {
  return { id: o.id, kind: o.kind, name: o.name, code: o.code, addressLines: o.addressLines, email: o.email, phone: o.phone, accreditation: o.accreditation };
}

/** The lab's e-mail choices as GET and PUT /organization/mail-settings answer them; a choice never made reads as off. */
export function presentMailSettings(o: Organization): MailSettingsBody {
  const settings = (o.settings ?? {}) as Record<string, unknown>;
  return { attachPdfToEmail: settings.attachPdfToEmail === true };
}

/**
 * GET/PUT /organization: the active organization's details (ISO/IEC 17025:2017 7.8.2.1 b: the
 * laboratory's name and address on every report). Reports already issued keep the details they
 * were rendered with; only reports issued after a change show the new ones.
 */
export function organizationRoutes(): RouteDef[] {
  return [
    route({
      method: 'get',
      path: '/organization',
      summary: 'The active organization’s details (name, code, address, contact, accreditation)',
      access: { kind: 'member', roles: ROLES },
      async handler(ctx) {
        const org = await Organization.findByPk(ctx.organizationId!);
        if (!org) throw notFound('The organization');
        return presentOrganization(org);
      },
    }),
    route<OrganizationDetailsBody>({
      method: 'put',
      path: '/organization',
      summary: 'Change the active organization’s details printed on reports and receipts (the code stays fixed); audited with before and after',
      access: { kind: 'member', roles: ['lab-admin', 'manufacturer-admin'] },
      bodySchema: organizationDetailsSchema,
      async handler(ctx) {
        const org = await Organization.findByPk(ctx.organizationId!, { lock: true });
        if (!org) throw notFound('The organization');
        const before = presentOrganization(org);
        await org.update({ name: ctx.body.name.trim(), addressLines: ctx.body.addressLines.map((l) => l.trim()), email: ctx.body.email, phone: ctx.body.phone, accreditation: ctx.body.accreditation });
        await audit(ctx, { action: 'update', entity: 'organization', entityId: org.id, before, after: presentOrganization(org) });
        return presentOrganization(org);
      },
    }),
    route({
      method: 'get',
      path: '/organization/mail-settings',
      summary: 'The lab’s e-mail choices: whether the report-issued e-mail carries the signed PDF (unset reads as false)',
      access: { kind: 'member', roles: ['lab-admin'] },
      async handler(ctx) {
        const org = await Organization.findByPk(ctx.organizationId!);
        if (!org) throw notFound('The organization');
        return presentMailSettings(org);
      },
    }),
    route<MailSettingsBody>({
      method: 'put',
      path: '/organization/mail-settings',
      summary: 'Choose whether the report-issued e-mail carries the signed PDF (organizations.settings.attachPdfToEmail); audited',
      access: { kind: 'member', roles: ['lab-admin'] },
      bodySchema: mailSettingsSchema,
      async handler(ctx) {
        const org = await Organization.findByPk(ctx.organizationId!, { lock: true });
        if (!org) throw notFound('The organization');
        const settings = org.settings as Record<string, unknown>;
        const before = presentMailSettings(org);
        // A new object, so Sequelize sees the JSON column change; other settings are kept.
        await org.update({ settings: { ...settings, attachPdfToEmail: ctx.body.attachPdfToEmail } });
        const after = { attachPdfToEmail: ctx.body.attachPdfToEmail };
        await audit(ctx, { action: 'mail-settings-update', entity: 'organization', entityId: org.id, before, after });
        ctx.status(200);
        return after;
      },
    }),
  ];
}
