import type { TraceEvaluation } from '../../shared/evaluation/evaluate-trace';
import { ENGINE_VERSION } from '../../shared/engine-version';
import type { Upload } from '../db/models';
import { preparedRows } from '../db/prepared-query';
import { apiKeyIdOf } from '../audit/audit';
import { todayIso } from '../instruments/calibration-status';
import type { UploadFacts, UploadResultFacts } from './upload-presenter';
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
 * transaction re-checks that the run is still on the bench (locking it) and writes the upload row,
 * its result, the run's last test date and the audit entry, in one prepared statement (the
 * analysis, tens of kilobytes of JSON, goes as a parameter rather than into the SQL text). Whole
 * or nothing: a storage failure removes what was already stored (and answers 507 or 500); a
 * database failure removes the stored files before the error goes on.
 */
export async function recordUpload(
  deps: UploadDeps,
  ctx: RouteContext,
  input: { uploadId: string; runId: string; testCaseId: string; prepared: PreparedUpload<object>; parameters: Record<string, unknown>; evaluation: TraceEvaluation; detail: Record<string, unknown> },
): Promise<{ upload: UploadFacts & Pick<Upload, 'analysis'>; result: UploadResultFacts }> {
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
      const e = input.evaluation;
      const userId = ctx.principal?.userId ?? null;
      const apiKeyId = apiKeyIdOf(ctx.req);
      const today = todayIso();
      const audited = { runId: input.runId, testCaseId: input.testCaseId, format: prepared.format, fileName: prepared.file.keptName, fileSha256: prepared.file.sha256, dataSha256: prepared.data?.sha256 ?? null, verdict: e.verdict };
      const [row] = await preparedRows<{ state: string | null; uploadCreatedAt: Date | null; resultId: string | null; resultCreatedAt: Date | null }>(transaction, RECORD_UPLOAD, [
        org, input.runId, input.uploadId, input.testCaseId, prepared.format, prepared.file.keptName, keys.file, prepared.file.sizeBytes, prepared.file.sha256,
        prepared.data?.keptName ?? null, keys.data, prepared.data?.sizeBytes ?? null, prepared.data?.sha256 ?? null,
        JSON.stringify(input.parameters), JSON.stringify(prepared.summary), ENGINE_VERSION, userId, apiKeyId,
        e.value, e.unit, e.limit, e.margin, e.uncertainty.expanded, e.uncertainty.coverageFactor, e.verdict, JSON.stringify(input.detail),
        today, JSON.stringify(audited),
      ]);
      if (row.state !== 'testing' || !row.uploadCreatedAt) throw conflict(`The run left the bench while the file was analysed; it is ${row.state ?? 'gone'}. Nothing was stored.`, { code: 'run-not-editable' });
      const upload = {
        id: input.uploadId,
        runId: input.runId,
        testCaseId: input.testCaseId,
        format: prepared.format,
        fileName: prepared.file.keptName,
        fileSizeBytes: prepared.file.sizeBytes,
        fileSha256: prepared.file.sha256,
        dataKey: keys.data,
        dataFileName: prepared.data?.keptName ?? null,
        dataSizeBytes: prepared.data?.sizeBytes ?? null,
        dataSha256: prepared.data?.sha256 ?? null,
        parameters: input.parameters,
        analysis: prepared.summary as unknown as Record<string, unknown>,
        engineVersion: ENGINE_VERSION,
        uploadedBy: userId,
        apiKeyId,
        createdAt: row.uploadCreatedAt,
      };
      const result = {
        id: row.resultId!,
        uploadId: input.uploadId,
        engineVersion: ENGINE_VERSION,
        value: e.value,
        unit: e.unit,
        limitValue: e.limit,
        margin: e.margin,
        expandedUncertainty: e.uncertainty.expanded,
        coverageFactor: e.uncertainty.coverageFactor,
        verdict: e.verdict,
        detail: input.detail,
        createdAt: row.resultCreatedAt!,
      };
      return { upload, result };
    });
  } catch (error) {
    await removeStored();
    throw error;
  }
}

/** Data-modifying CTEs each run once, to completion; nothing is written unless the locked run is on the bench. */
const RECORD_UPLOAD = `
WITH run AS (
  SELECT id, state FROM test_runs WHERE id = $2::uuid AND organization_id = $1::uuid FOR UPDATE
), upload AS (
  INSERT INTO uploads (id, organization_id, run_id, test_case_id, format, file_name, file_key, file_size_bytes, file_sha256,
                       data_file_name, data_key, data_size_bytes, data_sha256, parameters, analysis, engine_version, uploaded_by, api_key_id)
  SELECT $3::uuid, $1::uuid, run.id, $4::uuid, $5::text, $6::text, $7::text, $8::bigint, $9::text,
         $10::text, $11::text, $12::bigint, $13::text, $14::jsonb, $15::json, $16::text, $17::uuid, $18::uuid
    FROM run WHERE run.state = 'testing'
  RETURNING id, created_at
), result AS (
  INSERT INTO results (organization_id, run_id, test_case_id, upload_id, engine_version, value, unit, limit_value, margin,
                       expanded_uncertainty, coverage_factor, verdict, detail)
  SELECT $1::uuid, $2::uuid, $4::uuid, upload.id, $16::text, $19::float8, $20::text, $21::float8, $22::float8, $23::float8, $24::float8, $25::text, $26::jsonb
    FROM upload
  RETURNING id, created_at
), touched AS (
  UPDATE test_runs SET tested_to = $27::date, updated_at = now()
   WHERE id = $2::uuid AND tested_to IS DISTINCT FROM $27::date AND EXISTS (SELECT 1 FROM upload)
), logged AS (
  INSERT INTO audit_log (organization_id, user_id, api_key_id, action, entity, entity_id, after)
  SELECT $1::uuid, $17::uuid, $18::uuid, 'upload', 'upload', upload.id::text, $28::jsonb FROM upload
)
SELECT run.state, upload.created_at AS "uploadCreatedAt", result.id AS "resultId", result.created_at AS "resultCreatedAt"
  FROM (SELECT 1) one LEFT JOIN run ON true LEFT JOIN upload ON true LEFT JOIN result ON true`;
