/**
 * The auditor's side: the issued reports that an accepted, unrevoked, unexpired grant covers. An
 * auditor belongs to no organization of the labs that granted access, so row-level security
 * cannot name one; these queries run in the system scope (asSystem, listed in DEVELOPERS.md) and
 * the grant conditions below are the whole authority. A report no grant covers any more (expired
 * or revoked) answers 404, exactly like one that does not exist.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import { Report } from '../db/models';
import { notFound } from '../http/problem';
import type { ListQuery } from '../http/list-query';
import { asSystem } from '../tenancy/tenant-transaction';
import { isUuid } from '../accounts/is-uuid';

/**
 * Reports joined to what a grant can name (client, device) and filtered by the caller's live grants.
 * The IN list lets PostgreSQL start from the granting labs' (organization_id, issued_at) index.
 */
const COVERED = `
  FROM reports r
  JOIN test_runs tr ON tr.id = r.run_id
  JOIN test_plans p ON p.id = tr.plan_id
  JOIN devices d ON d.id = p.device_id
  WHERE r.organization_id IN (SELECT organization_id FROM auditor_grants WHERE auditor_user_id = :me AND revoked_at IS NULL)
    AND EXISTS (
    SELECT 1 FROM auditor_grants g
     WHERE g.auditor_user_id = :me AND g.organization_id = r.organization_id
       AND g.accepted_at IS NOT NULL AND g.revoked_at IS NULL
       AND g.expires_on >= (now() AT TIME ZONE 'UTC')::date
       AND (g.scope = 'all' OR (g.scope = 'client' AND g.client_id = d.client_id) OR (g.scope = 'device' AND g.device_id = d.id)))`;

export const AUDITOR_REPORT_SORT: Record<string, string> = { issuedAt: 'r.issued_at', reportNumber: 'r.report_number' };

export async function listAuditorReports(sequelize: Sequelize, userId: string, q: ListQuery) {
  const replacements: Record<string, unknown> = { me: userId, limit: q.pageSize, offset: (q.page - 1) * q.pageSize };
  let search = '';
  if (q.filter.search) {
    search = ` AND (r.report_number ILIKE :like OR r.summary->>'device' ILIKE :like OR r.summary->>'client' ILIKE :like OR r.summary->>'lab' ILIKE :like)`;
    replacements.like = `%${q.filter.search.replace(/[%_\\]/g, '\\$&')}%`;
  }
  const rows = await asSystem(sequelize, (transaction) =>
    sequelize.query<Record<string, unknown> & { summary: Record<string, unknown>; verifyToken: string; status: string | null; total: string }>(
      `SELECT r.id, r.report_number AS "reportNumber", r.revision, r.issued_at AS "issuedAt", r.sha256, r.page_count AS "pageCount",
              r.summary, r.verify_token AS "verifyToken",
              (SELECT s.status FROM report_status_changes s WHERE s.report_id = r.id ORDER BY s.created_at DESC LIMIT 1) AS status,
              count(*) OVER () AS total
       ${COVERED}${search}
       ORDER BY ${AUDITOR_REPORT_SORT[q.sort]} ${q.direction}, r.id LIMIT :limit OFFSET :offset`,
      { replacements, type: QueryTypes.SELECT, transaction },
    ),
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    items: rows.map(({ summary, verifyToken, status, total: _t, ...r }) => ({
      ...r,
      lab: summary.lab,
      client: summary.client,
      device: summary.device,
      serialNumber: summary.serialNumber,
      status: status ?? 'current',
      verifyPath: `/verify/${verifyToken}`,
    })),
  };
}

/** The signed PDF of one covered report, byte for byte as issued; 404 when no live grant covers it. */
export async function auditorReportPdf(sequelize: Sequelize, userId: string, reportId: string): Promise<Report> {
  if (!isUuid(reportId)) throw notFound('The report');
  const report = await asSystem(sequelize, async (transaction) => {
    const [hit] = await sequelize.query<{ id: string }>(`SELECT r.id ${COVERED} AND r.id = :id`, { replacements: { me: userId, id: reportId }, type: QueryTypes.SELECT, transaction });
    return hit ? Report.findByPk(hit.id, { transaction }) : null;
  });
  if (!report) throw notFound('The report');
  return report;
}
