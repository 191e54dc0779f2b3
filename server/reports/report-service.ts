/**
 * Issuing a report: one transaction renders and signs the PDF, stores it with its SHA-256,
 * moves the run to issued, writes the audit entry and enqueues the client's e-mail. A failure
 * anywhere rolls everything back, so there is either a complete issued report or none.
 */
import crypto from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import { AuditEntry, Organization, Report, ReportStatusChange, TestRun, User } from '../db/models';
import type { RouteContext } from '../http/route';
import { conflict, notFound } from '../http/problem';
import { audit } from '../audit/audit';
import { nextCounter } from '../runs/run-number';
import { presentRun } from '../runs/run-presenter';
import { buildReportDocument } from './build-report-document';
import { activeSigningIdentity } from './signing-identity-store';
import { consumeCreditForReport } from '../billing/consume-credit-for-report';
import { renderSignedCertificate, renderSignedReport } from '../signing/render-signed-documents';
import { buildCertificateDocument } from '../../templates/certificate/certificate-document';
import { reportIssuedEmail } from '../../templates/email/report-issued';
import type { Verdict } from '../../shared/uncertainty/decision-rule';

export interface ReportDeps {
  sequelize: Sequelize;
  publicUrl: string;
  keyEncryptionSecret: string;
  enqueueMail: (transaction: RouteContext['transaction'], mail: { to: string; subject: string; text: string; html: string; attachments?: { filename: string; contentBase64: string; contentType: string }[] }) => Promise<void>;
}

const VERDICT_WORDS: Record<Verdict, string> = { pass: 'Pass', 'conditional-pass': 'Conditional pass', 'conditional-fail': 'Conditional fail', fail: 'Fail' };

export function summarizeVerdicts(verdicts: Verdict[]): string {
  const counts = verdicts.reduce<Record<string, number>>((acc, v) => ((acc[v] = (acc[v] ?? 0) + 1), acc), {});
  return (Object.keys(VERDICT_WORDS) as Verdict[]).filter((v) => counts[v]).map((v) => `${counts[v]} ${VERDICT_WORDS[v].toLowerCase()}`).join(', ') || 'no results';
}

export async function issueReport(deps: ReportDeps, ctx: RouteContext, run: TestRun) {
  if (run.state !== 'approved') throw conflict(`Only an authorized run can be issued; this one is ${run.state}.`, { code: 'illegal-transition' });
  const lab = (await Organization.findByPk(run.organizationId))!;
  // A run issued before and reopened for correction gets the same number, next revision (7.8.8).
  const previous = await Report.findOne({ where: { organizationId: run.organizationId, runId: run.id }, order: [['revision', 'DESC']], attributes: { exclude: ['pdf'] } });
  let reportNumber: string;
  if (previous) {
    reportNumber = previous.reportNumber;
  } else {
    const n = await nextCounter(deps.sequelize, run.organizationId, `report-${new Date().getUTCFullYear()}`, ctx.transaction);
    reportNumber = `${lab.code}-${new Date().getUTCFullYear()}-${String(n).padStart(4, '0')}`;
  }
  const revision = previous ? previous.revision + 1 : 1;
  // One report credit of the client, taken in this transaction before anything can fail (server/billing).
  const reportId = crypto.randomUUID();
  await consumeCreditForReport(deps, ctx, { runId: run.id, reportId, revision });
  // The reason given when the run was reopened, from the append-only audit log.
  const reopened = previous ? await AuditEntry.findOne({ where: { entity: 'test-run', entityId: run.id, action: 'run-revise' }, order: [['id', 'DESC']] }) : null;
  const reason = (reopened?.after as { reason?: string } | null)?.reason ?? 'Corrected';
  const replaces = previous ? { reportNumber: `${previous.reportNumber} revision ${previous.revision}`, reason } : undefined;
  const verifyToken = crypto.randomBytes(18).toString('base64url');
  const issuedAt = new Date();
  const authorizer = (await User.findByPk(run.reviewerId ?? ctx.principal!.userId))!;
  const built = await buildReportDocument({ run, reportNumber, revision, replaces, issuedAt, authorizedBy: authorizer, verificationUrl: `${deps.publicUrl}/verify/${verifyToken}` });
  const identity = await activeSigningIdentity(run.organizationId, deps.keyEncryptionSecret);
  const signed = await renderSignedReport(built.doc, identity);
  const report = await Report.create({
    id: reportId,
    organizationId: run.organizationId,
    runId: run.id,
    clientOrganizationId: built.clientOrganizationId,
    reportNumber,
    revision,
    replacesReportId: previous?.id ?? null,
    replacesReason: replaces?.reason ?? null,
    verifyToken,
    sha256: signed.sha256,
    pdf: signed.pdf,
    pageCount: signed.pageCount,
    summary: {
      device: `${built.doc.device.manufacturer} ${built.doc.device.model}`,
      serialNumber: built.doc.device.serialNumber,
      client: built.doc.client.name,
      lab: lab.name,
      verdicts: built.verdicts,
      receivedOn: built.doc.dates.received,
      testedFrom: built.doc.dates.testedFrom,
      testedTo: built.doc.dates.testedTo,
    },
    issuedBy: ctx.principal!.userId,
    issuedAt,
  });
  // The compliance certificate summarises the verdicts and refers to the report by number.
  const certificate = await renderSignedCertificate(buildCertificateDocument(built.doc), identity);
  await deps.sequelize.query(
    'INSERT INTO report_certificates (report_id, organization_id, client_organization_id, sha256, pdf) VALUES (:report, :org, :client, :sha, :pdf)',
    { replacements: { report: report.id, org: run.organizationId, client: built.clientOrganizationId, sha: certificate.sha256, pdf: certificate.pdf }, transaction: ctx.transaction ?? undefined },
  );
  if (previous) {
    await ReportStatusChange.create({ organizationId: run.organizationId, reportId: previous.id, status: 'superseded', reason: replaces!.reason, supersededById: report.id, changedBy: ctx.principal!.userId });
  }
  const before = presentRun(run);
  await run.update({ state: 'issued', returnReason: null });
  await audit(ctx, { action: 'run-issue', entity: 'test-run', entityId: run.id, before, after: { ...presentRun(run), reportId: report.id, reportNumber, sha256: signed.sha256 } });
  const mail = reportIssuedEmail({
    contactName: built.contactName,
    labName: lab.name,
    reportNumber,
    deviceLabel: `${built.doc.device.manufacturer} ${built.doc.device.model} (s/n ${built.doc.device.serialNumber})`,
    verdictSummary: summarizeVerdicts(built.verdicts),
    downloadUrl: `${deps.publicUrl}/reports/${report.id}`,
    verifyUrl: `${deps.publicUrl}/verify/${verifyToken}`,
    attached: (lab.settings as { attachPdfToEmail?: boolean }).attachPdfToEmail === true,
  });
  await deps.enqueueMail(ctx.transaction, {
    to: built.contactEmail,
    ...mail,
    attachments: (lab.settings as { attachPdfToEmail?: boolean }).attachPdfToEmail === true
      ? [{ filename: `${reportNumber}.pdf`, contentBase64: signed.pdf.toString('base64'), contentType: 'application/pdf' }]
      : undefined,
  });
  return presentReport(report, []);
}

/** Withdraw an issued report: the record stays, a status change says why (ISO/IEC 17025:2017 7.8.8). */
export async function withdrawReport(ctx: RouteContext, reportId: string, reason: string) {
  const report = await loadReport(reportId);
  if (report.organizationId !== ctx.organizationId) throw notFound('The report');
  const changes = await ReportStatusChange.findAll({ where: { reportId } });
  if (reportStatus(changes).status !== 'current') throw conflict(`Report ${report.reportNumber} revision ${report.revision} is already ${reportStatus(changes).status}.`, { code: 'report-not-current' });
  const change = await ReportStatusChange.create({ organizationId: report.organizationId, reportId, status: 'withdrawn', reason, changedBy: ctx.principal!.userId });
  const run = (await TestRun.findByPk(report.runId))!;
  const before = presentRun(run);
  await run.update({ state: 'withdrawn' });
  await audit(ctx, { action: 'report-withdraw', entity: 'report', entityId: reportId, before, after: { ...presentRun(run), reason } });
  return presentReport(report, [...changes, change]);
}

export function reportStatus(changes: ReportStatusChange[]) {
  const latest = [...changes].sort((a, b) => b.createdAt.getTime() - a.createdAt.getTime())[0];
  if (!latest) return { status: 'current' as const, reason: null, supersededById: null };
  return { status: latest.status, reason: latest.reason, supersededById: latest.supersededById };
}

export function presentReport(r: Report, changes: ReportStatusChange[]) {
  return {
    id: r.id,
    runId: r.runId,
    reportNumber: r.reportNumber,
    revision: r.revision,
    sha256: r.sha256,
    pageCount: r.pageCount,
    summary: r.summary,
    issuedAt: r.issuedAt.toISOString(),
    verifyPath: `/verify/${r.verifyToken}`,
    ...reportStatus(changes),
  };
}

export async function listReports(sequelize: Sequelize, q: { organizationId: string; limit: number; offset: number; search?: string; sort: string; direction: 'ASC' | 'DESC' }) {
  const SORT: Record<string, string> = { issuedAt: 'r.issued_at', reportNumber: 'r.report_number' };
  // Explicit organization predicate (a lab's own, or a manufacturer's as client) so the indexes apply.
  const where = `WHERE (r.organization_id = :org OR r.client_organization_id = :org)${q.search ? ` AND (r.report_number ILIKE :like OR r.summary->>'device' ILIKE :like OR r.summary->>'client' ILIKE :like)` : ''}`;
  const rows = await sequelize.query<Record<string, unknown>>(
    `SELECT r.id, r.run_id AS "runId", r.report_number AS "reportNumber", r.revision, r.sha256, r.page_count AS "pageCount", r.summary,
            r.issued_at AS "issuedAt", r.verify_token AS "verifyToken",
            (SELECT s.status FROM report_status_changes s WHERE s.report_id = r.id ORDER BY s.created_at DESC LIMIT 1) AS status,
            count(*) OVER () AS total
       FROM reports r ${where} ORDER BY ${SORT[q.sort] ?? 'r.issued_at'} ${q.direction}, r.id LIMIT :limit OFFSET :offset`,
    { replacements: { org: q.organizationId, limit: q.limit, offset: q.offset, like: `%${(q.search ?? '').replace(/[%_\\]/g, '\\$&')}%` }, type: QueryTypes.SELECT },
  );
  return {
    total: rows.length ? Number(rows[0].total) : 0,
    items: rows.map(({ total: _t, verifyToken, status, ...r }) => ({ ...r, status: status ?? 'current', verifyPath: `/verify/${verifyToken}` })),
  };
}

export async function loadReport(id: string) {
  const r = await Report.findByPk(id);
  if (!r) throw notFound('The report');
  return r;
}
