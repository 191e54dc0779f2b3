import type { Result, Upload } from '../db/models';

/** What an upload's presentation reads: a model instance, or the row just written (record-upload.ts). */
export type UploadFacts = Pick<Upload, 'id' | 'runId' | 'testCaseId' | 'format' | 'fileName' | 'fileSizeBytes' | 'fileSha256' | 'dataKey' | 'dataFileName' | 'dataSizeBytes' | 'dataSha256' | 'parameters' | 'engineVersion' | 'uploadedBy' | 'apiKeyId' | 'createdAt'>;
export type UploadResultFacts = Pick<Result, 'id' | 'uploadId' | 'engineVersion' | 'value' | 'unit' | 'limitValue' | 'margin' | 'expandedUncertainty' | 'coverageFactor' | 'verdict' | 'detail' | 'createdAt'>;

/** An upload as listed: what was received and how, without the analysis (which can be large). */
export function presentUpload(u: UploadFacts) {
  return {
    id: u.id,
    runId: u.runId,
    testCaseId: u.testCaseId,
    format: u.format,
    file: { name: u.fileName, sizeBytes: u.fileSizeBytes, sha256: u.fileSha256, href: `/api/uploads/${u.id}/file` },
    data: u.dataKey === null ? null : { name: u.dataFileName, sizeBytes: u.dataSizeBytes, sha256: u.dataSha256, href: `/api/uploads/${u.id}/file?part=data` },
    parameters: u.parameters,
    engineVersion: u.engineVersion,
    uploadedBy: u.uploadedBy,
    viaApiKey: u.apiKeyId !== null,
    createdAt: u.createdAt.toISOString(),
  };
}

/** A result computed from an upload: the reading-result fields with the upload it came from. */
export function presentUploadResult(r: UploadResultFacts) {
  return {
    id: r.id,
    uploadId: r.uploadId,
    engineVersion: r.engineVersion,
    value: r.value,
    unit: r.unit,
    limit: r.limitValue,
    margin: r.margin,
    expandedUncertainty: r.expandedUncertainty,
    coverageFactor: r.coverageFactor,
    verdict: r.verdict,
    detail: r.detail,
    createdAt: r.createdAt.toISOString(),
  };
}

/** One upload in full: metadata, the analysis (figures and the thinned trace or PSD) and its result. */
export function presentUploadDetail(u: UploadFacts & Pick<Upload, 'analysis'>, result: UploadResultFacts | null) {
  return { ...presentUpload(u), analysis: u.analysis, result: result && presentUploadResult(result) };
}
