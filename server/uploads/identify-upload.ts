import { detectFileKind } from '../../shared/import/detect-file-kind';
import type { UploadFormat } from '../../shared/schemas/uploads';
import { unsupportedMediaType, validationFailed } from '../http/problem';
import type { ReceivedPart } from './receive-multipart';

const DESCRIBED: Record<UploadFormat, string> = {
  'trace-csv': 'a spectrum trace (CSV)',
  sigmf: 'SigMF metadata (.sigmf-meta)',
  wav: 'a RIFF/WAVE I/Q recording',
  cf32: 'headerless cf32 I/Q samples',
  ci16: 'headerless ci16 I/Q samples',
};

// What a name or a Content-Type claims. Only compared with the bytes, never used to decide.
const BY_EXTENSION: Record<string, UploadFormat> = {
  csv: 'trace-csv', tsv: 'trace-csv', wav: 'wav', wave: 'wav', 'sigmf-meta': 'sigmf',
  cf32: 'cf32', fc32: 'cf32', cfile: 'cf32', ci16: 'ci16', cs16: 'ci16', sc16: 'ci16',
};
const BY_CONTENT_TYPE: [RegExp, UploadFormat][] = [
  [/^text\/(csv|tab-separated-values)\b/i, 'trace-csv'],
  [/^audio\/(wav|wave|x-wav|vnd\.wave)\b/i, 'wav'],
];

/** True when the bytes are text (no control bytes but tab, CR, LF): traces and metadata are. */
function isText(head: Buffer): boolean {
  for (const byte of head.subarray(0, 512)) if ((byte < 0x20 && byte !== 9 && byte !== 10 && byte !== 13) || byte === 0x7f) return false;
  return true;
}

/**
 * What an upload is, from its bytes (shared detectFileKind: RIFF/WAVE signature, SigMF JSON,
 * delimited text); headerless binary I/Q has no signature, so for it the `format` field must say
 * cf32 or ci16. Every label the sender gave — the `format` field, the file name's extension, a
 * specific Content-Type — must agree with the bytes: a CSV named `.wav`, or a WAV sent as
 * format=trace-csv, is refused with 415 rather than read as something else. A SigMF recording
 * needs its samples in the `data` part, which must be binary.
 *
 * @throws Problem 415 (type unknown or mislabelled) or 422 (a part missing or unexpected).
 */
export function identifyUpload(file: ReceivedPart, data: ReceivedPart | null, declared: UploadFormat | undefined): UploadFormat {
  if (file.sizeBytes === 0) throw validationFailed('The file is empty. Nothing was stored.', [{ pointer: '/file', message: 'is empty' }]);
  // 8 KiB, not just 512 bytes: analyzer exports may open with a long block of '#' comments.
  const content = detectFileKind('', file.head.subarray(0, 8192));
  let format: UploadFormat;
  if (content.kind === 'wav') format = 'wav';
  else if (content.kind === 'sigmf-meta') format = 'sigmf';
  else if (content.kind === 'trace-csv') format = 'trace-csv';
  else if (content.kind === 'sigmf-archive') throw unsupportedMediaType('The file is a SigMF archive (tar): unpack it and send the .sigmf-meta as "file" and the .sigmf-data as "data".');
  else if (!isText(file.head) && file.sizeBytes > 0 && (declared === 'cf32' || declared === 'ci16')) format = declared;
  else if (!isText(file.head) && file.sizeBytes > 0) throw unsupportedMediaType('The file has no header that says what it holds. For headerless I/Q samples send format=cf32 or format=ci16 with sampleRateHz; traces are CSV, recordings SigMF or WAV.');
  else throw unsupportedMediaType('The file is neither a spectrum trace (CSV with a header row), SigMF metadata, a WAV recording nor I/Q samples.');

  const labels: [string, UploadFormat | undefined][] = [
    ['the format field', declared],
    ['its name', BY_EXTENSION[/\.([^.]+)$/.exec(file.originalName.toLowerCase())?.[1] ?? '']],
    ['its Content-Type', BY_CONTENT_TYPE.find(([pattern]) => pattern.test(file.contentType))?.[1]],
  ];
  for (const [where, label] of labels) {
    if (label !== undefined && label !== format) {
      throw unsupportedMediaType(`The file's contents are ${DESCRIBED[format]}, but ${where} says ${DESCRIBED[label]}. Check that the right file was picked; the server reads the type from the bytes. Nothing was stored.`);
    }
  }
  if (format === 'sigmf' && !data) throw validationFailed('A SigMF recording needs its samples: send the .sigmf-data file as "data". Nothing was stored.', [{ pointer: '/data', message: 'is required with SigMF metadata' }]);
  if (format !== 'sigmf' && data) throw validationFailed(`Only SigMF metadata comes with a "data" part; this file is ${DESCRIBED[format]}. Nothing was stored.`, [{ pointer: '/data', message: 'is only for SigMF samples' }]);
  if (data) {
    const dataKind = detectFileKind('', data.head.subarray(0, 512)).kind;
    if (dataKind === 'wav' || dataKind === 'sigmf-meta' || dataKind === 'trace-csv' || (data.sizeBytes > 0 && isText(data.head))) {
      throw unsupportedMediaType(`The "data" part is ${dataKind === 'wav' ? 'a WAV file' : 'text'}, not SigMF samples: send the .sigmf-data file there. Nothing was stored.`);
    }
  }
  return format;
}
