/** Auditor grants (the lab's side) and the auditor's read-only view of the reports they cover. */
import { fileAnswer, route, type RouteDef } from '../http/route';
import { page, readListQuery } from '../http/list-query';
import { badRequest } from '../http/problem';
import { createAuditorGrantSchema, type CreateAuditorGrantBody } from '../../shared/schemas/accounts';
import type { AccountDeps } from '../accounts/account-deps';
import { createGrant, GRANT_STATUSES, listGrants, revokeGrant } from './grants';
import { AUDITOR_REPORT_SORT, auditorReportPdf, listAuditorReports } from './auditor-reports';

export function auditorRoutes(deps: AccountDeps): RouteDef[] {
  return [
    route<CreateAuditorGrantBody>({
      method: 'post',
      path: '/auditor-grants',
      summary: 'Give an outside auditor read-only access to issued reports (all, one client or one device) until a date; e-mails an invitation',
      access: { kind: 'member', roles: ['lab-admin'] },
      bodySchema: createAuditorGrantSchema,
      async handler(ctx) {
        return createGrant(deps, ctx);
      },
    }),
    route({
      method: 'get',
      path: '/auditor-grants',
      summary: 'The lab’s auditor grants with their status, paginated (status)',
      access: { kind: 'member', roles: ['lab-admin'] },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['createdAt', 'expiresOn', 'email'], filterable: ['status'], defaultSort: '-createdAt' });
        if (q.filter.status && !GRANT_STATUSES.includes(q.filter.status)) throw badRequest(`status must be one of ${GRANT_STATUSES.join(', ')}.`);
        const { items, total } = await listGrants(ctx.organizationId!, q);
        return page(items, total, q);
      },
    }),
    route({
      method: 'delete',
      path: '/auditor-grants/:id',
      summary: 'Revoke an auditor grant (its reports disappear from the auditor’s view at once)',
      access: { kind: 'member', roles: ['lab-admin'] },
      async handler(ctx) {
        await revokeGrant(ctx, ctx.params.id);
        ctx.status(204);
        return undefined;
      },
    }),
    route({
      method: 'get',
      path: '/auditor/reports',
      summary: 'Auditor: the issued reports my live grants cover, with lab, client, device and status',
      access: { kind: 'signed-in' },
      transaction: 'none',
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: Object.keys(AUDITOR_REPORT_SORT), filterable: ['search'], defaultSort: '-issuedAt' });
        const { items, total } = await listAuditorReports(deps.sequelize, ctx.principal!.userId, q);
        return page(items, total, q);
      },
    }),
    route({
      method: 'get',
      path: '/auditor/reports/:id/pdf',
      summary: 'Auditor: the signed PDF of a covered report, exactly as issued',
      access: { kind: 'signed-in' },
      transaction: 'none',
      async handler(ctx) {
        const r = await auditorReportPdf(deps.sequelize, ctx.principal!.userId, ctx.params.id);
        return fileAnswer({ contentType: 'application/pdf', filename: `${r.reportNumber}-rev${r.revision}.pdf`, body: r.pdf });
      },
    }),
  ];
}
