import type { RouteContext } from '../http/route';
import { inTenant } from '../tenancy/tenant-transaction';
import { refuseOverdue } from '../instruments/run-instruments';
import { todayIso } from '../instruments/calibration-status';
import { ingestUpload } from './ingest-upload';
import { receiveMultipart } from './receive-multipart';
import { loadUploadTarget } from './upload-target';
import type { UploadDeps } from './upload-deps';

/**
 * POST /runs/:id/cases/:caseId/uploads. The route runs without the router's transaction, so no
 * database connection is held while a file streams in: (1) a short tenant transaction checks the
 * run, the case and the bench's instruments before a byte of the body is read; (2) the parts
 * stream to the incoming folder with SHA-256; (3) the file is identified from its bytes, analysed
 * with the shared engine (streaming for I/Q) and judged against the plan's rule set; (4) only then
 * the files are stored and, in one transaction, the upload, its result and the audit entry
 * written (ingestUpload). The request waits for the analysis (see DEVELOPERS.md: uploads).
 */
export async function createUpload(deps: UploadDeps, ctx: RouteContext): Promise<unknown> {
  const target = await inTenant(deps.sequelize, ctx.organizationId, (transaction) => loadUploadTarget(transaction, ctx.organizationId!, ctx.params.id, ctx.params.caseId));
  refuseOverdue(target.instruments, todayIso(), 'Replace or recalibrate it before uploading measurements made with it.');
  const received = await receiveMultipart(ctx.req, ctx.res, { incomingDir: deps.incomingDir, maxFileBytes: deps.settings.maxFileBytes, allowData: true });
  try {
    const detail = await ingestUpload(deps, ctx, target, received);
    ctx.status(201);
    return detail;
  } finally {
    await received.discard();
  }
}
