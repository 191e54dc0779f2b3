import { pipeline } from 'node:stream/promises';
import { route, type RouteDef } from '../http/route';
import { badRequest, notFound, Problem } from '../http/problem';
import { page, readListQuery } from '../http/list-query';
import { Result, RuleSet, TestRun, Upload } from '../db/models';
import { StorageError } from '../storage/file-storage';
import { inTenant } from '../tenancy/tenant-transaction';
import { createUpload } from './create-upload';
import { createPrecheckLimiter } from './precheck-limiter';
import { runPrecheck } from './run-precheck';
import type { UploadDeps } from './upload-deps';
import { presentUpload, presentUploadDetail } from './upload-presenter';

const LAB = ['lab-admin', 'engineer', 'reviewer', 'billing'] as const;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const SORT: Record<string, string> = { createdAt: 'createdAt', fileName: 'fileName', format: 'format', sizeBytes: 'fileSizeBytes' };
const CONTENT_TYPE: Record<string, string> = { 'trace-csv': 'text/csv', sigmf: 'application/json', wav: 'audio/wav', cf32: 'application/octet-stream', ci16: 'application/octet-stream' };
const SUMMARY_ATTRIBUTES = { exclude: ['analysis'] as ['analysis'] };

/** Uploads of traces and I/Q captures to a run's test cases, and the manufacturer's pre-check. */
export function uploadRoutes(deps: UploadDeps): RouteDef[] {
  const limiter = createPrecheckLimiter(deps.sequelize, deps.settings.precheckPerHour);
  return [
    route({
      method: 'post',
      path: '/runs/:id/cases/:caseId/uploads',
      summary: 'Upload a spectrum trace (CSV) or an I/Q recording (SigMF pair, WAV, raw cf32/ci16) for a test case; it is analysed and judged with the shared engine (multipart/form-data: file, data, format, sampleRateHz, centerHz, referenceDbm, fullScaleDbm, sideband)',
      access: { kind: 'member-or-api-key', roles: ['lab-admin', 'engineer'] },
      transaction: 'none',
      handler: (ctx) => createUpload(deps, ctx),
    }),
    route({
      method: 'get',
      path: '/runs/:id/uploads',
      summary: 'The uploads of a run, paginated, sortable (createdAt, fileName, format, sizeBytes) and filterable (testCaseId, format), each with its verdict',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        const run = await TestRun.findByPk(ctx.params.id);
        if (!run) throw notFound('The test run');
        const q = readListQuery(ctx.query, { sortable: Object.keys(SORT), filterable: ['testCaseId', 'format'], defaultSort: '-createdAt' });
        if (q.filter.testCaseId && !UUID.test(q.filter.testCaseId)) throw badRequest('testCaseId must be a test case id.');
        // The explicit organization predicate lets the (organization_id, run_id, ...) index serve the list.
        const where = { organizationId: ctx.organizationId!, runId: run.id, ...(q.filter.testCaseId && { testCaseId: q.filter.testCaseId }), ...(q.filter.format && { format: q.filter.format }) };
        const { rows, count } = await Upload.findAndCountAll({ where, attributes: SUMMARY_ATTRIBUTES, order: [[SORT[q.sort], q.direction], ['id', 'ASC']], limit: q.pageSize, offset: (q.page - 1) * q.pageSize });
        const results = rows.length ? await Result.findAll({ where: { organizationId: ctx.organizationId!, uploadId: rows.map((u) => u.id) } }) : [];
        return page(rows.map((u) => {
          const r = results.find((x) => x.uploadId === u.id);
          return { ...presentUpload(u), result: r ? { id: r.id, verdict: r.verdict, value: r.value, unit: r.unit, limit: r.limitValue, margin: r.margin } : null };
        }), count, q);
      },
    }),
    route({
      method: 'get',
      path: '/uploads/:id',
      summary: 'One upload: what was received, the analysis (figures and the thinned trace or PSD for the chart) and the result',
      access: { kind: 'member', roles: LAB },
      async handler(ctx) {
        const upload = await Upload.findByPk(ctx.params.id);
        if (!upload) throw notFound('The upload');
        return presentUploadDetail(upload, await Result.findOne({ where: { uploadId: upload.id } }));
      },
    }),
    route({
      method: 'get',
      path: '/uploads/:id/file',
      summary: 'The raw file exactly as received (?part=data for the samples of a SigMF recording), with its SHA-256 in Repr-Digest',
      access: { kind: 'member', roles: LAB },
      transaction: 'none', // the bytes stream after the lookup's transaction has ended
      async handler(ctx) {
        const part = ctx.query.part ?? 'file';
        if (part !== 'file' && part !== 'data') throw badRequest('part must be "file" or "data".');
        const upload = await inTenant(deps.sequelize, ctx.organizationId, () => Upload.findByPk(ctx.params.id, { attributes: SUMMARY_ATTRIBUTES }));
        if (!upload) throw notFound('The upload');
        const key = part === 'data' ? upload.dataKey : upload.fileKey;
        if (!key) throw notFound('The data part of this upload');
        const stream = await deps.storage.get(key).catch((error: unknown) => {
          if (error instanceof StorageError) throw new Problem({ status: 500, code: 'file-missing', title: 'Stored file unavailable', detail: 'The stored file cannot be read right now; tell the lab administrator.' });
          throw error;
        });
        const [name, size, sha256] = part === 'data' ? [upload.dataFileName!, upload.dataSizeBytes!, upload.dataSha256!] : [upload.fileName, upload.fileSizeBytes, upload.fileSha256];
        ctx.res
          .status(200)
          .type(part === 'data' ? 'application/octet-stream' : CONTENT_TYPE[upload.format])
          .set('Content-Length', String(size))
          .set('Content-Disposition', `attachment; filename="${name.replace(/[^A-Za-z0-9._-]/g, '_')}"`)
          .set('Repr-Digest', `sha-256=:${Buffer.from(sha256, 'hex').toString('base64')}:`); // RFC 9530
        // A client that goes away mid-download just ends the stream; the answer has already started.
        await pipeline(stream, ctx.res).catch(() => ctx.res.destroy());
      },
    }),
    route({
      method: 'get',
      path: '/precheck/rule-sets',
      summary: 'The built-in sample rule sets a manufacturer may run a pre-check against (latest version of each)',
      access: { kind: 'member', roles: ['manufacturer-admin', 'manufacturer-viewer'] },
      async handler() {
        const rows = await RuleSet.findAll({ where: { organizationId: null, isSample: true }, order: [['name', 'ASC'], ['version', 'DESC']] });
        const latest = new Map<string, RuleSet>();
        for (const row of rows) if (!latest.has(row.key)) latest.set(row.key, row);
        return { items: [...latest.values()].map((r) => ({ id: r.id, key: r.key, name: r.name, version: r.version, description: r.body.sampleNotice ?? undefined })) };
      },
    }),
    route({
      method: 'post',
      path: '/precheck',
      summary: 'Manufacturer self-service pre-check: analyse a trace or capture against a built-in sample rule set; returns every margin and the phasing diagnosis, stores nothing, and is not an accredited result (multipart/form-data: file, data, ruleSetId and the upload parameters)',
      access: { kind: 'member', roles: ['manufacturer-admin', 'manufacturer-viewer'] },
      transaction: 'none',
      handler: (ctx) => runPrecheck(deps, limiter, ctx),
    }),
  ];
}
