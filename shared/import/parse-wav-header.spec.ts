import fc from 'fast-check';
import { ImportError } from './import-error';
import { createIqSampleDecoder } from './iq-sample-decoder';
import { parseWavHeader } from './parse-wav-header';

// Layout: Microsoft/IBM RIFF WAVE "Multimedia Programming Interface and Data Specifications 1.0"
// (fmt chunk: format, channels, rate, byte rate, block align, bits), written here field by field.
interface WavSpec {
  format?: number;
  channels?: number;
  rateHz?: number;
  bits?: number;
  byteRate?: number;
  blockAlign?: number;
  riffSizeDelta?: number;
  dataSizeDelta?: number;
  extra?: Array<{ id: string; size: number }>;
  extensibleSubformat?: number;
}

function buildWav(samples: number[], spec: WavSpec = {}): Uint8Array {
  const format = spec.format ?? 1;
  const channels = spec.channels ?? 2;
  const bits = spec.bits ?? (format === 3 || spec.extensibleSubformat === 3 ? 32 : 16);
  const rateHz = spec.rateHz ?? 48000;
  const blockAlign = spec.blockAlign ?? (channels * bits) / 8;
  const fmtSize = spec.extensibleSubformat === undefined ? 16 : 40;
  const extraBytes = (spec.extra ?? []).reduce((n, c) => n + 8 + c.size + (c.size % 2), 0);
  const dataBytes = samples.length * (bits / 8);
  const total = 12 + 8 + fmtSize + extraBytes + 8 + dataBytes;
  const view = new DataView(new ArrayBuffer(total));
  const tag = (at: number, text: string) =>
    [...text].forEach((c, k) => view.setUint8(at + k, c.charCodeAt(0)));
  tag(0, 'RIFF');
  view.setUint32(4, total - 8 + (spec.riffSizeDelta ?? 0), true);
  tag(8, 'WAVE');
  let at = 12;
  for (const chunk of spec.extra ?? []) {
    tag(at, chunk.id);
    view.setUint32(at + 4, chunk.size, true);
    at += 8 + chunk.size + (chunk.size % 2);
  }
  tag(at, 'fmt ');
  view.setUint32(at + 4, fmtSize, true);
  view.setUint16(at + 8, spec.extensibleSubformat === undefined ? format : 0xfffe, true);
  view.setUint16(at + 10, channels, true);
  view.setUint32(at + 12, rateHz, true);
  view.setUint32(at + 16, spec.byteRate ?? rateHz * blockAlign, true);
  view.setUint16(at + 20, blockAlign, true);
  view.setUint16(at + 22, bits, true);
  if (spec.extensibleSubformat !== undefined) {
    view.setUint16(at + 24, 22, true);
    view.setUint16(at + 26, bits, true);
    view.setUint32(at + 28, 3, true);
    // KSDATAFORMAT_SUBTYPE GUID {0000000X-0000-0010-8000-00aa00389b71}
    const tail = [0, 0, 0, 0, 0, 0x10, 0, 0x80, 0, 0, 0xaa, 0, 0x38, 0x9b, 0x71];
    const guid = [spec.extensibleSubformat, ...tail];
    guid.forEach((b, k) => view.setUint8(at + 32 + k, b));
  }
  at += 8 + fmtSize;
  tag(at, 'data');
  view.setUint32(at + 4, dataBytes + (spec.dataSizeDelta ?? 0), true);
  at += 8;
  samples.forEach((s, k) => {
    if (bits === 32) view.setFloat32(at + 4 * k, s, true);
    else view.setInt16(at + 2 * k, Math.round(s * 32768), true);
  });
  return new Uint8Array(view.buffer);
}

function errorOf(bytes: Uint8Array, fileLength = bytes.length): ImportError {
  try {
    parseWavHeader(bytes, fileLength);
  } catch (error) {
    if (error instanceof ImportError) return error;
    throw error;
  }
  throw new Error('expected an ImportError');
}

describe('parseWavHeader', () => {
  const iq = [0.5, -0.25, 0.125, 0.75, -1, 0];

  it('reads a 16-bit PCM stereo header and its data decodes to I left, Q right', () => {
    const bytes = buildWav(iq, { rateHz: 192000 });
    const header = parseWavHeader(bytes, bytes.length);
    expect(header).toMatchObject({ encoding: 'pcm16', sampleRateHz: 192000, dataOffset: 44 });
    expect(header.frameCount).toBe(3);
    const chunk = createIqSampleDecoder(header.datatype).push(bytes.subarray(header.dataOffset));
    expect([...chunk.i]).toEqual([0.5, 0.125, -1]);
    expect([...chunk.q]).toEqual([-0.25, 0.75, 0]);
  });

  it('reads float 32 and WAVE_FORMAT_EXTENSIBLE, skipping other chunks with odd padding', () => {
    const float = buildWav(iq, { format: 3, extra: [{ id: 'LIST', size: 5 }] });
    const header = parseWavHeader(float, float.length);
    expect(header).toMatchObject({ encoding: 'float32', dataOffset: 12 + 14 + 24 + 8 });
    const decoded = createIqSampleDecoder(header.datatype).push(float.subarray(header.dataOffset));
    expect([...decoded.i]).toEqual([0.5, 0.125, -1]);
    const extensible = buildWav(iq, { extensibleSubformat: 1 });
    expect(parseWavHeader(extensible, extensible.length).encoding).toBe('pcm16');
    const extensibleFloat = buildWav(iq, { extensibleSubformat: 3 });
    expect(parseWavHeader(extensibleFloat, extensibleFloat.length).encoding).toBe('float32');
  });

  it.each([
    ['a RIFF size beyond the file', { riffSizeDelta: 100 }, 4, /RIFF size says/],
    ['a data size beyond the file', { dataSizeDelta: 4 }, 40, /past the end/],
    ['a data size that is not whole frames', { dataSizeDelta: -2 }, 40, /whole number/],
    ['a wrong byte rate', { byteRate: 1000 }, 28, /byte rate/],
    ['a wrong block align', { blockAlign: 2 }, 32, /block align/],
    ['one channel', { channels: 1 }, 22, /channel/],
    ['24-bit PCM', { bits: 24 }, 34, /bits per sample/],
    ['A-law', { format: 6 }, 20, /audio format 6/],
    ['a zero sample rate', { rateHz: 0 }, 24, /sample rate is 0/],
    ['mu-law as an extensible sub-format', { extensibleSubformat: 7 }, 44, /audio format 7/],
  ])('refuses a header that lies: %s, at the field', (_, spec, byteOffset, message) => {
    const error = errorOf(buildWav(iq, spec));
    expect(error.message).toMatch(message);
    expect(error.byteOffset).toBe(byteOffset);
  });

  it('refuses truncated files and files that are not WAV', () => {
    const bytes = buildWav(iq);
    expect(errorOf(bytes.subarray(0, 30), 30).message).toMatch(/truncated|RIFF size/);
    expect(errorOf(bytes.subarray(0, 8), 8)).toMatchObject({ byteOffset: 0 });
    const notRiff = bytes.slice();
    notRiff.set([0x52, 0x49, 0x46, 0x58]);
    expect(errorOf(notRiff).message).toMatch(/not a RIFF file/);
    const fileLongerThanHead = errorOf(bytes.subarray(0, 40), bytes.length);
    expect(fileLongerThanHead.message).toMatch(/header bytes read/);
  });

  it('refuses an extensible sub-format GUID of another family', () => {
    const bytes = buildWav(iq, { extensibleSubformat: 1 });
    bytes[12 + 8 + 24 + 15] ^= 0xff;
    const message = expect.stringMatching(/GUID/);
    expect(errorOf(bytes)).toMatchObject({ byteOffset: 44, message });
  });

  it('refuses a data chunk before the fmt chunk', () => {
    const bytes = buildWav([], { extra: [{ id: 'data', size: 0 }] });
    expect(errorOf(bytes)).toMatchObject({ byteOffset: 12 });
  });

  it('never throws anything but ImportError on arbitrary or corrupted bytes (fuzz)', () => {
    const valid = buildWav(iq, { extra: [{ id: 'LIST', size: 3 }] });
    const corrupted = fc
      .array(fc.tuple(fc.nat(valid.length - 1), fc.integer({ min: 0, max: 255 })), { maxLength: 4 })
      .map((edits) => {
        const copy = valid.slice();
        for (const [at, value] of edits) copy[at] = value;
        return copy;
      });
    const anyBytes = fc.oneof(fc.uint8Array({ maxLength: 100 }), corrupted);
    fc.assert(
      fc.property(anyBytes, fc.nat(200), (bytes, n) => {
        for (const fileLength of [bytes.length, bytes.length + n]) {
          try {
            const header = parseWavHeader(bytes, fileLength);
            const end = header.dataOffset + header.dataLengthBytes;
            expect(end).toBeLessThanOrEqual(fileLength);
          } catch (error) {
            expect(error).toBeInstanceOf(ImportError);
          }
        }
      }),
      { seed: 44, numRuns: 1000 },
    );
  });
});
