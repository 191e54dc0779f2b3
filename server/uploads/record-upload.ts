import type { TraceEvaluation } from '../../shared/evaluation/evaluate-trace';
import { ENGINE_VERSION } from '../../shared/engine-version';
import { audit } from '../audit/audit';
import { Result, TestRun, Upload } from '../db/models';
import { conflict } from '../http/problem';
import type { RouteContext } from '../http/route';
import { StorageError } from '../storage/file-storage';
import { storageKey } from '../storage/storage-key';
import { inTenant } from '../tenancy/tenant-transaction';
import type { PreparedUpload } from './prepare-upload';
import type { UploadDeps } from './upload-deps';
import { storageProblem } from './upload-problems';

/**
 * Keeps an analysed upload: the raw files go into the store unchanged under keys built from the
 * organization and a new upload id (`uploads/<org>/<id>/file`, `.../data`), then ONE tenant
 * transaction re-checks that the run is still on the bench and writes the upload row, its result
 * and the audit entry. Whole or nothing: a storage failure removes what was already stored (and
 * answers 507 or 500); a database failure removes the stored files before the error goes on.
 */
export async function recordUpload(
  deps: UploadDeps,
  ctx: RouteContext,
  input: { uploadId: string; runId: string; testCaseId: string; prepared: PreparedUpload<object>; parameters: Record<string, unknown>; evaluation: TraceEvaluation; detail: Record<string, unknown> },
): Promise<{ upload: Upload; result: Result }> {
  const org = ctx.organizationId!;
  const { prepared } = input;
  const keys = { file: storageKey('uploads', org, input.uploadId, 'file'), data: prepared.data ? storageKey('uploads', org, input.uploadId, 'data') : null };
  const stored: string[] = [];
  const removeStored = () => Promise.all(stored.map((key) => deps.storage.delete(key).catch(() => undefined)));
  try {
    for (const [key, from, sizeBytes] of [[keys.file, prepared.placed.filePath, prepared.file.sizeBytes], [keys.data, prepared.placed.dataPath, prepared.data?.sizeBytes]] as const) {
      if (!key || !from) continue;
      const info = await deps.storage.put(key, { moveFrom: from });
      stored.push(key);
      if (info.sizeBytes !== sizeBytes) throw new StorageError('failed', `storage: ${key} holds ${info.sizeBytes} bytes, ${sizeBytes} were received`);
    }
  } catch (error) {
    await removeStored();
    if (error instanceof StorageError) throw storageProblem(error);
    throw error;
  }
  try {
    return await inTenant(deps.sequelize, org, async (transaction) => {
      const run = await TestRun.findByPk(input.runId, { lock: transaction.LOCK.UPDATE });
      if (!run || run.state !== 'testing') throw conflict(`The run left the bench while the file was analysed; it is ${run?.state ?? 'gone'}. Nothing was stored.`, { code: 'run-not-editable' });
      const e = input.evaluation;
      const upload = await Upload.create({
        id: input.uploadId,
        organizationId: org,
        runId: run.id,
        testCaseId: input.testCaseId,
        format: prepared.format,
        fileName: prepared.file.keptName,
        fileKey: keys.file,
        fileSizeBytes: prepared.file.sizeBytes,
        fileSha256: prepared.file.sha256,
        dataFileName: prepared.data?.keptName ?? null,
        dataKey: keys.data,
        dataSizeBytes: prepared.data?.sizeBytes ?? null,
        dataSha256: prepared.data?.sha256 ?? null,
        parameters: input.parameters,
        analysis: prepared.summary as unknown as Record<string, unknown>,
        engineVersion: ENGINE_VERSION,
        uploadedBy: ctx.principal?.userId ?? null,
        apiKeyId: (ctx.req as { apiKey?: { keyId: string } | null }).apiKey?.keyId ?? null,
      });
      const result = await Result.create({
        organizationId: org,
        runId: run.id,
        testCaseId: input.testCaseId,
        readingId: null,
        uploadId: upload.id,
        engineVersion: ENGINE_VERSION,
        value: e.value,
        unit: e.unit,
        limitValue: e.limit,
        margin: e.margin,
        expandedUncertainty: e.uncertainty.expanded,
        coverageFactor: e.uncertainty.coverageFactor,
        verdict: e.verdict,
        detail: input.detail,
      });
      await run.update({ testedTo: new Date().toISOString().slice(0, 10) });
      await audit({ ...ctx, transaction }, { action: 'upload', entity: 'upload', entityId: upload.id, after: { runId: run.id, testCaseId: input.testCaseId, format: upload.format, fileName: upload.fileName, fileSha256: upload.fileSha256, dataSha256: upload.dataSha256, verdict: result.verdict } });
      return { upload, result };
    });
  } catch (error) {
    await removeStored();
    throw error;
  }
}
