import { Report, ReportStatusChange } from '../db/models';
import { fileAnswer, route, type RouteDef } from '../http/route';
import { notFound } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { asSystem } from '../tenancy/tenant-transaction';
import { loadRun } from '../runs/run-service';
import { issueReport, listReports, loadReport, presentReport, reportStatus, withdrawReport, type ReportDeps } from './report-service';
import { reasonSchema } from '../../shared/schemas/records';
import { transition } from '../runs/run-service';
import { runDetail } from '../runs/run-detail';
import { preparedRows } from '../db/prepared-query';

const REPORT_PDF = 'SELECT report_number AS "reportNumber", revision, pdf FROM reports WHERE id = $1';

const READERS = ['lab-admin', 'engineer', 'reviewer', 'billing', 'manufacturer-admin', 'manufacturer-viewer'] as const;

export function reportRoutes(deps: ReportDeps): RouteDef[] {
  return [
    route({
      method: 'post',
      path: '/runs/:id/issue',
      summary: 'Issue the signed report of an authorized run',
      access: { kind: 'member', roles: ['lab-admin', 'reviewer'] },
      async handler(ctx) {
        return issueReport(deps, ctx, await loadRun(ctx.params.id));
      },
    }),
    route<{ reason: string }>({
      method: 'post',
      path: '/reports/:id/withdraw',
      summary: 'Withdraw an issued report, with the reason (the record is kept)',
      access: { kind: 'member', roles: ['lab-admin', 'reviewer'] },
      bodySchema: reasonSchema,
      async handler(ctx) {
        ctx.status(200);
        return withdrawReport(ctx, ctx.params.id, ctx.body.reason);
      },
    }),
    route<{ reason: string }>({
      method: 'post',
      path: '/runs/:id/revise',
      summary: 'Reopen an issued run for correction; re-issuing supersedes the report with a new revision',
      access: { kind: 'member', roles: ['lab-admin', 'reviewer'] },
      bodySchema: reasonSchema,
      async handler(ctx) {
        ctx.status(200);
        return runDetail(ctx.transaction!, (await transition(ctx, await loadRun(ctx.params.id), 'revise', ctx.body.reason)).id);
      },
    }),
    route({
      method: 'get',
      path: '/reports',
      summary: 'Issued reports: a lab sees its own, a manufacturer those issued to it',
      access: { kind: 'member', roles: READERS },
      async handler(ctx) {
        const q = readListQuery(ctx.query, { sortable: ['issuedAt', 'reportNumber'], filterable: ['search'], defaultSort: '-issuedAt' });
        const { items, total } = await listReports(deps.sequelize, { organizationId: ctx.organizationId!, limit: q.pageSize, offset: (q.page - 1) * q.pageSize, search: q.filter.search, sort: q.sort, direction: q.direction });
        return page(items, total, q);
      },
    }),
    route({
      method: 'get',
      path: '/reports/:id',
      summary: 'One issued report (metadata and status)',
      access: { kind: 'member', roles: READERS },
      async handler(ctx) {
        const r = await loadReport(ctx.params.id);
        return presentReport(r, await ReportStatusChange.findAll({ where: { reportId: r.id } }));
      },
    }),
    route({
      method: 'get',
      path: '/reports/:id/pdf',
      summary: 'Download the signed PDF exactly as issued',
      access: { kind: 'member', roles: READERS },
      async handler(ctx) {
        // The most requested file: one prepared statement, committed with it (server/db/prepared-query.ts).
        const [r] = await preparedRows<{ reportNumber: string; revision: number; pdf: Buffer }>(ctx.transaction!, REPORT_PDF, [ctx.params.id], { thenCommit: true });
        if (!r) throw notFound('The report');
        return fileAnswer({ contentType: 'application/pdf', filename: `${r.reportNumber}-rev${r.revision}.pdf`, body: r.pdf });
      },
    }),
    route({
      method: 'get',
      path: '/reports/:id/certificate',
      summary: 'Download the signed compliance certificate issued with the report',
      access: { kind: 'member', roles: READERS },
      async handler(ctx) {
        const r = await loadReport(ctx.params.id);
        const [rows] = await deps.sequelize.query('SELECT pdf FROM report_certificates WHERE report_id = :id', { replacements: { id: r.id }, transaction: ctx.transaction ?? undefined });
        const row = (rows as { pdf: Buffer }[])[0];
        if (!row) throw notFound('The certificate');
        return fileAnswer({ contentType: 'application/pdf', filename: `${r.reportNumber}-rev${r.revision}-certificate.pdf`, body: row.pdf });
      },
    }),
    route({
      method: 'get',
      path: '/verify/:token',
      summary: 'Public: is this report authentic and current?',
      access: { kind: 'public' },
      transaction: 'none',
      async handler(ctx) {
        // Public lookup by an unguessable token; system scope because the caller has no organization.
        return asSystem(deps.sequelize, async () => {
          const token = ctx.params.token;
          if (!/^[A-Za-z0-9_-]{10,64}$/.test(token)) throw notFound('The report');
          const r = await Report.findOne({ where: { verifyToken: token }, attributes: { exclude: ['pdf'] } });
          if (!r) throw notFound('The report');
          const status = reportStatus(await ReportStatusChange.findAll({ where: { reportId: r.id } }));
          const supersededBy = status.supersededById ? await Report.findByPk(status.supersededById, { attributes: ['reportNumber', 'revision', 'verifyToken'] }) : null;
          const s = r.summary as Record<string, unknown>;
          return {
            reportNumber: r.reportNumber,
            revision: r.revision,
            lab: s.lab,
            client: s.client,
            device: s.device,
            serialNumber: s.serialNumber,
            receivedOn: s.receivedOn,
            testedFrom: s.testedFrom,
            testedTo: s.testedTo,
            issuedAt: r.issuedAt.toISOString(),
            sha256: r.sha256,
            status: status.status,
            reason: status.reason,
            supersededBy: supersededBy && { reportNumber: supersededBy.reportNumber, revision: supersededBy.revision, verifyPath: `/verify/${supersededBy.verifyToken}` },
          };
        });
      },
    }),
  ];
}
