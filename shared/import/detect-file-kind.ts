/** The kinds of upload the importers understand (plus what we recognise but do not read). */
export type FileKind =
  | 'sigmf-meta'
  | 'sigmf-data'
  | 'sigmf-archive'
  | 'wav'
  | 'trace-csv'
  | 'raw-cf32'
  | 'raw-ci16'
  | 'unknown';

/** The verdict with the reason, for showing to the person who uploaded the file. */
export interface DetectedFileKind {
  kind: FileKind;
  reason: string;
}

const RAW_EXTENSIONS: Record<string, FileKind> = {
  cf32: 'raw-cf32',
  fc32: 'raw-cf32',
  cfile: 'raw-cf32',
  ci16: 'raw-ci16',
  sc16: 'raw-ci16',
  cs16: 'raw-ci16',
};

/**
 * Guesses what an uploaded file is from its first bytes (content wins) and its name. Signatures:
 * `RIFF....WAVE` (WAV), `ustar` at offset 257 (a tar archive; `.sigmf` archives are tar files,
 * SigMF specification "Archive Format"), a JSON object with a `"global"` member (SigMF
 * metadata), printable text whose first non-comment line has a `,`, `;` or tab (trace CSV).
 * Headerless binary I/Q has no signature, so `.sigmf-data`, `.cf32`/`.cfile`/`.fc32` and
 * `.ci16`/`.cs16`/`.sc16` are told by name alone. Never throws.
 *
 * @param name the file name as uploaded (only the extension is used).
 * @param firstBytes the first bytes of the file; 512 are enough.
 * @example detectFileKind('capture.sigmf-meta', new TextEncoder().encode('{"global":{}}'))
 * // { kind: 'sigmf-meta', reason: 'JSON object with a "global" member' }
 */
export function detectFileKind(name: string, firstBytes: Uint8Array): DetectedFileKind {
  const ascii = (from: number, length: number) =>
    String.fromCharCode(...firstBytes.subarray(from, from + length));
  const extension = /\.([^./\\]+)$/.exec(name.toLowerCase())?.[1] ?? '';
  if (ascii(0, 4) === 'RIFF' && ascii(8, 4) === 'WAVE') {
    return { kind: 'wav', reason: 'RIFF/WAVE signature' };
  }
  if (ascii(257, 5) === 'ustar') {
    const reason = 'tar archive (unpack the .sigmf-meta and .sigmf-data files first)';
    return { kind: extension === 'sigmf' ? 'sigmf-archive' : 'unknown', reason };
  }
  if (extension === 'sigmf-data') return { kind: 'sigmf-data', reason: 'named .sigmf-data' };
  const raw = RAW_EXTENSIONS[extension];
  if (raw !== undefined) return { kind: raw, reason: `named .${extension}` };

  const text = printableText(firstBytes);
  if (text === undefined) {
    return { kind: 'unknown', reason: 'binary data without a known signature' };
  }
  if (/^\s*\{/.test(text) && (/"global"\s*:/.test(text) || extension === 'sigmf-meta')) {
    return { kind: 'sigmf-meta', reason: 'JSON object with a "global" member' };
  }
  const firstLine = text
    .split(/\r\n|\n|\r/)
    .map((line) => line.trim())
    .find((line) => line !== '' && !line.startsWith('#'));
  if (firstLine !== undefined && /[,;\t]/.test(firstLine)) {
    return { kind: 'trace-csv', reason: 'delimited text' };
  }
  return { kind: 'unknown', reason: 'text that is neither SigMF metadata nor a delimited trace' };
}

/** The bytes as text when they look like text (no control bytes but tab, CR, LF). */
function printableText(bytes: Uint8Array): string | undefined {
  for (const byte of bytes) {
    if (byte < 0x20 && byte !== 9 && byte !== 10 && byte !== 13) return undefined;
    if (byte === 0x7f) return undefined;
  }
  return new TextDecoder('utf-8', { fatal: false }).decode(bytes);
}
