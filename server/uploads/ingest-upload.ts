import crypto from 'node:crypto';
import { uploadFieldsSchema, type UploadFields } from '../../shared/schemas/uploads';
import type { RouteContext } from '../http/route';
import { contributionsByBudget, instrumentsOnRecord } from '../instruments/run-instruments';
import { evaluateUpload, uploadResultDetail } from '../analysis/evaluate-upload';
import { prepareUpload } from './prepare-upload';
import type { ReceivedUpload } from './receive-multipart';
import { recordUpload } from './record-upload';
import { caseDefaults, type UploadTarget } from './upload-target';
import type { UploadDeps } from './upload-deps';
import { presentUploadDetail } from './upload-presenter';

/**
 * From received parts to a stored upload with its result, for one test case of a run: identify
 * and analyse (prepareUpload), judge against the plan's rule set with the bench instruments'
 * contributions in the budget, then store files and rows whole or not at all (recordUpload).
 * The API's upload route and the demo seed both come through here. The caller removes the
 * received folder afterwards (`received.discard()`), whatever happened.
 */
export async function ingestUpload(
  deps: UploadDeps,
  ctx: RouteContext,
  target: UploadTarget,
  received: ReceivedUpload,
) {
  const { instruments, rules } = target;
  const prepared = await prepareUpload<UploadFields>(received, { schema: uploadFieldsSchema, maxTraceBytes: deps.settings.maxTraceBytes, defaults: caseDefaults(target) });
  const evaluation = evaluateUpload({ kind: target.kind, evidence: prepared.evidence, rules, contributions: contributionsByBudget(instruments) });
  const detail = uploadResultDetail(evaluation, {
    summary: prepared.summary,
    rules,
    instruments: instrumentsOnRecord(instruments),
  });
  const parameters = { ...prepared.fields, carrierHz: prepared.carrierHz, sideband: prepared.sideband };
  const { upload, result } = await recordUpload(deps, ctx, { uploadId: crypto.randomUUID(), runId: target.runId, testCaseId: target.caseId, prepared, parameters, evaluation, detail });
  return presentUploadDetail(upload, result);
}
