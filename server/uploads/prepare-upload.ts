import type { UploadEvidence } from '../../shared/evaluation/evaluate-trace';
import type { UploadFields, UploadFormat } from '../../shared/schemas/uploads';
import { payloadTooLarge, validationFailed } from '../http/problem';
import { analyseUpload, type UploadSummary } from '../analysis/analyse-upload';
import { checkUploadFields } from './check-upload-fields';
import { keptFileName } from './file-name';
import { identifyUpload } from './identify-upload';
import { placeParts, type PlacedParts } from './place-parts';
import type { ReceivedPart, ReceivedUpload } from './receive-multipart';
import { readUploadFields } from './upload-fields';
import { formatBytes } from './upload-problems';

export interface PreparedUpload<F extends UploadFields> {
  fields: F;
  format: UploadFormat;
  file: ReceivedPart & { keptName: string };
  data: (ReceivedPart & { keptName: string }) | null;
  placed: PlacedParts;
  carrierHz: number | null;
  sideband: 'usb' | 'lsb' | 'auto';
  evidence: UploadEvidence;
  summary: UploadSummary;
}

/**
 * Everything between receiving an upload and storing it, shared by lab uploads and the
 * manufacturer's pre-check: the fields validated, the names checked, the type read from the
 * bytes and compared with every label, the parameters checked against the type, the trace size
 * limit, and the analysis with the shared engine. Nothing here writes outside the request's
 * incoming folder, so a refusal at any step leaves nothing stored.
 *
 * @param options.defaults the test case's carrier frequency and sideband, when there is a case.
 * @param options.checkFields a check of the fields that needs the database (before any analysis).
 */
export async function prepareUpload<F extends UploadFields>(
  received: ReceivedUpload,
  options: { schema: object; maxTraceBytes: number; defaults: { carrierHz?: number; sideband?: 'usb' | 'lsb' }; checkFields?: (fields: F) => Promise<void> },
): Promise<PreparedUpload<F>> {
  if (!received.file) throw validationFailed('The upload has no file: send it in the part "file".', [{ pointer: '/file', message: 'is required' }]);
  const fields = readUploadFields<F>(received.fields, options.schema);
  await options.checkFields?.(fields);
  const file = { ...received.file, keptName: keptFileName(received.file.originalName, 'file') };
  const data = received.data && { ...received.data, keptName: keptFileName(received.data.originalName, 'data') };
  const format = identifyUpload(file, data, fields.format);
  checkUploadFields(format, fields);
  if (format === 'trace-csv' && file.sizeBytes > options.maxTraceBytes) {
    throw payloadTooLarge(`A trace CSV is read whole, so it may be at most ${formatBytes(options.maxTraceBytes)}; this one is ${formatBytes(file.sizeBytes)}. Nothing was stored.`);
  }
  const carrierHz = fields.centerHz ?? options.defaults.carrierHz ?? null;
  if (format === 'trace-csv' && carrierHz === null) {
    throw validationFailed('centerHz is required: the carrier frequency on the trace\'s frequency axis. Nothing was stored.', [{ pointer: '/centerHz', message: 'is required for a trace' }]);
  }
  const sideband = fields.sideband ?? options.defaults.sideband ?? 'auto';
  const placed = await placeParts(received, format);
  const analysed = await analyseUpload({ format, filePath: placed.filePath, fields, carrierHz: carrierHz ?? undefined, sideband });
  return { fields, format, file, data, placed, carrierHz, sideband, ...analysed };
}
