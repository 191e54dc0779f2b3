import { ImportError } from './import-error';
import { sigmfDatatypeFromName, type SigmfDatatype } from './sigmf-datatype';

/** The facts of a two-channel I/Q WAV file needed to decode its data chunk. */
export interface WavHeader {
  encoding: 'pcm16' | 'float32';
  sampleRateHz: number;
  /** File offset of the first data byte. */
  dataOffset: number;
  dataLengthBytes: number;
  /** Stereo frames = complex samples. */
  frameCount: number;
  /** How to decode the data bytes: ci16_le or cf32_le (I = left, Q = right). */
  datatype: SigmfDatatype;
}

const NAME = 'parseWavHeader';
const FORMAT_PCM = 1;
const FORMAT_FLOAT = 3;
const FORMAT_EXTENSIBLE = 0xfffe;
// KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT: the format code, then the fixed GUID tail.
const GUID_TAIL = [
  0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71,
];

/**
 * Parses the RIFF/WAVE header of a two-channel I/Q recording (I left, Q right), PCM 16-bit or
 * IEEE float 32-bit, plain or WAVE_FORMAT_EXTENSIBLE (Microsoft RIFF/WAVE multimedia
 * specification). Every length field is checked against `fileLengthBytes`, so a header that lies
 * (a RIFF or data size beyond the file, a byte rate or block alignment that disagrees with the
 * channel count and bit depth, a data size that is not a whole number of frames) is refused.
 * Chunks other than `fmt ` and `data` are skipped; odd-sized chunks are padded to even length.
 *
 * @param head the first bytes of the file, at least up to the start of the data chunk
 *   (64 KiB is plenty for ordinary files).
 * @param fileLengthBytes the full file length in bytes.
 * @throws ImportError naming the byte offset of the field that is wrong.
 * @example parseWavHeader(first64k, 768044)
 * // { encoding: 'pcm16', sampleRateHz: 48000, dataOffset: 44, dataLengthBytes: 768000,
 * //   frameCount: 192000, ... }
 */
export function parseWavHeader(head: Uint8Array, fileLengthBytes: number): WavHeader {
  const view = new DataView(head.buffer, head.byteOffset, head.byteLength);
  const fail = (byteOffset: number, detail: string): never => {
    throw new ImportError(NAME, detail, { byteOffset });
  };
  const need = (offset: number, length: number, what: string): void => {
    if (offset + length > fileLengthBytes) fail(offset, `file ends before ${what} (truncated)`);
    if (offset + length > head.length) {
      fail(offset, `${what} lies beyond the ${head.length} header bytes read`);
    }
  };
  const tag = (offset: number) => String.fromCharCode(...head.subarray(offset, offset + 4));

  need(0, 12, 'the RIFF header');
  if (tag(0) !== 'RIFF') fail(0, `not a RIFF file (starts with "${printable(tag(0))}")`);
  if (tag(8) !== 'WAVE') fail(8, `RIFF form type is "${printable(tag(8))}", not "WAVE"`);
  const riffEnd = 8 + view.getUint32(4, true);
  if (riffEnd > fileLengthBytes) {
    const detail = `RIFF size says ${riffEnd} bytes but the file has ${fileLengthBytes}`;
    fail(4, `${detail} (header lies or file truncated)`);
  }

  let format: WavFormat | undefined;
  for (let at = 12; ; ) {
    need(at, 8, 'the next chunk header (no "data" chunk found)');
    const id = tag(at);
    const size = view.getUint32(at + 4, true);
    const body = at + 8;
    if (body + size > riffEnd) {
      const detail = `chunk "${printable(id)}" claims ${size} bytes`;
      fail(at + 4, `${detail}, past the end of the RIFF data at ${riffEnd}`);
    }
    if (id === 'fmt ') {
      if (format !== undefined) fail(at, 'a second "fmt " chunk');
      need(body, Math.min(size, 40), 'the end of the "fmt " chunk');
      format = readFormat(view, body, size, fail);
    } else if (id === 'data') {
      if (format === undefined) return fail(at, '"data" chunk comes before the "fmt " chunk');
      if (size % format.blockAlign !== 0) {
        fail(at + 4, `data size ${size} is not a whole number of ${format.blockAlign}-byte frames`);
      }
      const datatype = sigmfDatatypeFromName(format.encoding === 'pcm16' ? 'ci16_le' : 'cf32_le');
      if (datatype === undefined) throw new Error('parseWavHeader: internal datatype table broken');
      return {
        encoding: format.encoding,
        sampleRateHz: format.sampleRateHz,
        dataOffset: body,
        dataLengthBytes: size,
        frameCount: size / format.blockAlign,
        datatype,
      };
    }
    at = body + size + (size % 2);
  }
}

interface WavFormat {
  encoding: WavHeader['encoding'];
  sampleRateHz: number;
  blockAlign: number;
}

function readFormat(
  view: DataView,
  body: number,
  size: number,
  fail: (byteOffset: number, detail: string) => never,
): WavFormat {
  if (size < 16) fail(body - 4, `"fmt " chunk is ${size} bytes; at least 16 are needed`);
  let code = view.getUint16(body, true);
  let codeOffset = body;
  const channels = view.getUint16(body + 2, true);
  const sampleRateHz = view.getUint32(body + 4, true);
  const byteRate = view.getUint32(body + 8, true);
  const blockAlign = view.getUint16(body + 12, true);
  const bits = view.getUint16(body + 14, true);
  if (code === FORMAT_EXTENSIBLE) {
    if (size < 40) {
      fail(body - 4, `WAVE_FORMAT_EXTENSIBLE "fmt " chunk is ${size} bytes; 40 are needed`);
    }
    code = view.getUint16(body + 24, true);
    codeOffset = body + 24;
    const tailOk = GUID_TAIL.every((byte, k) => view.getUint8(body + 26 + k) === byte);
    if (!tailOk) fail(body + 24, 'unknown WAVE_FORMAT_EXTENSIBLE sub-format GUID');
  }
  if (code !== FORMAT_PCM && code !== FORMAT_FLOAT) {
    fail(codeOffset, `audio format ${code} is not supported (only PCM = 1 and IEEE float = 3)`);
  }
  if (channels !== 2) fail(body + 2, `${channels} channel(s); an I/Q file has 2 (I left, Q right)`);
  const expectedBits = code === FORMAT_PCM ? 16 : 32;
  if (bits !== expectedBits) {
    fail(body + 14, `${bits} bits per sample; supported are PCM 16-bit and float 32-bit`);
  }
  if (sampleRateHz === 0) fail(body + 4, 'sample rate is 0');
  if (blockAlign !== (channels * bits) / 8) {
    const detail = `block align ${blockAlign} disagrees with ${channels} channels of ${bits} bits`;
    fail(body + 12, detail);
  }
  if (byteRate !== sampleRateHz * blockAlign) {
    fail(body + 8, `byte rate ${byteRate} disagrees with ${sampleRateHz} Hz x ${blockAlign} bytes`);
  }
  return { encoding: code === FORMAT_PCM ? 'pcm16' : 'float32', sampleRateHz, blockAlign };
}

function printable(text: string): string {
  return text.replace(/[^\x20-\x7e]/g, '?');
}
