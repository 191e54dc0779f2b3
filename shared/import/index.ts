// File importers: pure parsers over strings and byte chunks (no I/O), usable in the browser and
// on the server. Every bad file raises ImportError with a line/column or byte offset.
export { ImportError, type ImportErrorLocation } from './import-error';
export {
  sigmfDatatypeFromName,
  isRealSigmfDatatype,
  type SigmfDatatype,
  type SampleComponentType,
} from './sigmf-datatype';
export { parseSigmfMeta, type SigmfMeta, type SigmfCapture } from './parse-sigmf-meta';
export { createIqSampleDecoder, type IqSampleDecoder, type IqChunk } from './iq-sample-decoder';
export { parseWavHeader, type WavHeader } from './parse-wav-header';
export { rawIqDatatype } from './raw-iq-datatype';
export { parseTraceCsv, type ImportedTrace } from './parse-trace-csv';
export { classifyTraceColumn, type TraceColumn } from './trace-column';
export {
  levelToDbm,
  normalizeUnit,
  isLevelUnit,
  FREQUENCY_UNIT_HZ,
  type LevelUnit,
} from './trace-units';
export { parseCsvNumber } from './parse-csv-number';
export { detectFileKind, type FileKind, type DetectedFileKind } from './detect-file-kind';
export { jsonSyntaxErrorOffset } from './json-syntax-error-offset';
export { lineColumnAt, jsonKeyPosition, type TextPosition } from './text-position';
