import type { UploadEvidence } from '../../shared/evaluation/evaluate-trace';
import type { UploadFields, UploadFormat } from '../../shared/schemas/uploads';
import { analyseIqFile, type IqSummary } from './analyse-iq-file';
import { analyseTraceFile, type TraceSummary } from './analyse-trace-file';

export type UploadSummary = TraceSummary | IqSummary;

export interface UploadToAnalyse {
  format: UploadFormat;
  /** The placed main file (see server/uploads/place-parts.ts). */
  filePath: string;
  fields: UploadFields;
  /** Carrier frequency: the sender's centerHz, else the test case's frequency (Hz); a trace needs it. */
  carrierHz?: number;
  /** The sender's sideband, else the test case's; 'auto' lets an I/Q analysis find it. */
  sideband: 'usb' | 'lsb' | 'auto';
}

/**
 * Analyses one upload with the shared engine: a trace CSV is parsed and summarised (the mask and
 * bandwidth are judged later, against the rule set); an I/Q recording is streamed through the
 * I/Q analyzer. A trace has no 'auto' sideband: it is read as USB unless told otherwise, which
 * matters only for masks whose assigned frequency is offset from the carrier.
 *
 * @returns the evidence for evaluateTrace and the summary stored with the upload.
 * @throws ImportProblem / analysisFailed (422) for a file the engine refuses.
 */
export async function analyseUpload(input: UploadToAnalyse): Promise<{ evidence: UploadEvidence; summary: UploadSummary }> {
  const { format, fields } = input;
  if (format === 'trace-csv') {
    if (input.carrierHz === undefined) throw new TypeError('analyseUpload: a trace needs carrierHz');
    return analyseTraceFile(input.filePath, { carrierHz: input.carrierHz, sideband: input.sideband === 'lsb' ? 'lsb' : 'usb', ...(fields.referenceDbm !== undefined && { referenceDbm: fields.referenceDbm }) });
  }
  return analyseIqFile(input.filePath, {
    format,
    sideband: input.sideband,
    ...(input.carrierHz !== undefined && { centerHz: input.carrierHz }),
    ...(fields.sampleRateHz !== undefined && { sampleRateHz: fields.sampleRateHz }),
    ...(fields.fullScaleDbm !== undefined && { fullScaleDbm: fields.fullScaleDbm }),
  });
}
