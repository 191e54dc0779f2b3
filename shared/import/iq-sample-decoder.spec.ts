import fc from 'fast-check';
import { ImportError } from './import-error';
import { createIqSampleDecoder, type IqChunk } from './iq-sample-decoder';
import { sigmfDatatypeFromName } from './sigmf-datatype';

/** Encodes codes with DataView directly, independently of the decoder's own reader table. */
function encode(name: string, codes: number[]): Uint8Array {
  const datatype = sigmfDatatypeFromName(name)!;
  const size = datatype.bytesPerComponent;
  const view = new DataView(new ArrayBuffer(codes.length * size));
  const le = datatype.littleEndian;
  codes.forEach((code, k) => {
    const at = k * size;
    if (name.startsWith('cf32')) view.setFloat32(at, code, le);
    else if (name.startsWith('cf64')) view.setFloat64(at, code, le);
    else if (name.startsWith('ci32')) view.setInt32(at, code, le);
    else if (name.startsWith('ci16')) view.setInt16(at, code, le);
    else if (name.startsWith('cu16')) view.setUint16(at, code, le);
    else if (name === 'ci8') view.setInt8(at, code);
    else view.setUint8(at, code);
  });
  return new Uint8Array(view.buffer);
}

function decodeInChunks(
  name: string,
  bytes: Uint8Array,
  cuts: number[],
): { i: number[]; q: number[] } {
  const decoder = createIqSampleDecoder(sigmfDatatypeFromName(name)!);
  const out: IqChunk[] = [];
  let from = 0;
  for (const cut of [...cuts, bytes.length]) {
    out.push(decoder.push(bytes.subarray(from, cut)));
    from = cut;
  }
  decoder.finish();
  return { i: out.flatMap((c) => [...c.i]), q: out.flatMap((c) => [...c.q]) };
}

describe('createIqSampleDecoder', () => {
  // Expected values from the normalization rule (ci16: v/32768; cu8: (v - 127.5)/127.5).
  it.each([
    ['cf32_le', [0.25, -0.5, 1, -1], [0.25, 1], [-0.5, -1]],
    ['cf32_be', [0.25, -0.5, 1, -1], [0.25, 1], [-0.5, -1]],
    ['cf64_le', [0.125, -0.75, 0, 2], [0.125, 0], [-0.75, 2]],
    ['ci16_le', [16384, -32768, 32767, 0], [0.5, 32767 / 32768], [-1, 0]],
    ['ci16_be', [16384, -32768, -8192, 8192], [0.5, -0.25], [-1, 0.25]],
    ['ci32_le', [2 ** 30, -(2 ** 31), 0, -(2 ** 29)], [0.5, 0], [-1, -0.25]],
    ['cu16_le', [65535, 0, 32767, 32768], [1, -0.5 / 32767.5], [-1, 0.5 / 32767.5]],
    ['ci8', [64, -128, 127, 0], [0.5, 127 / 128], [-1, 0]],
    ['cu8', [255, 0, 191, 64], [1, 63.5 / 127.5], [-1, -63.5 / 127.5]],
  ])('decodes %s', (name, codes, i, q) => {
    const got = decodeInChunks(name, encode(name, codes), []);
    got.i.forEach((v, k) => expect(v).toBeCloseTo(i[k], 6));
    got.q.forEach((v, k) => expect(v).toBeCloseTo(q[k], 6));
    expect(got.i).toHaveLength(i.length);
  });

  it('gives the same samples wherever a split (every byte offset) cuts the stream', () => {
    for (const name of ['cf32_le', 'ci16_be', 'cu8', 'cf64_le']) {
      const codes = name === 'cu8' ? [1, 2, 3, 250, 7, 9] : [0.5, -0.25, 3, -4, 100, -0];
      const bytes = encode(name, name.startsWith('cf') ? codes : codes.map((c) => Math.trunc(c)));
      const whole = decodeInChunks(name, bytes, []);
      for (let cut = 0; cut <= bytes.length; cut++) {
        expect(decodeInChunks(name, bytes, [cut])).toEqual(whole);
      }
      const oneByteCuts = Array.from({ length: bytes.length }, (_, k) => k);
      expect(decodeInChunks(name, bytes, oneByteCuts)).toEqual(whole);
    }
  });

  it('counts the samples it returned', () => {
    const decoder = createIqSampleDecoder(sigmfDatatypeFromName('ci16_le')!);
    decoder.push(new Uint8Array(10));
    expect(decoder.sampleCount).toBe(2);
  });

  it('refuses a truncated stream at finish, naming where the partial sample starts', () => {
    const cf32 = sigmfDatatypeFromName('cf32_le')!;
    const decoder = createIqSampleDecoder(cf32, { baseByteOffset: 44 });
    decoder.push(new Uint8Array(8 * 3 + 5));
    const error = captureError(() => decoder.finish());
    expect(error).toBeInstanceOf(ImportError);
    expect((error as ImportError).byteOffset).toBe(44 + 24);
    const message = (error as ImportError).message;
    expect(message).toMatch(/^decodeIqSamples: byte offset 68: .*5 trailing/);
  });

  it('refuses NaN and infinite components with their byte offset, across a split', () => {
    const bytes = encode('cf32_le', [0, 0, 0.5, NaN]);
    const decoder = createIqSampleDecoder(sigmfDatatypeFromName('cf32_le')!);
    decoder.push(bytes.subarray(0, 10));
    const error = captureError(() => decoder.push(bytes.subarray(10)));
    expect(error).toMatchObject({ name: 'ImportError', byteOffset: 12 });
    const inf = encode('cf64_be', [Infinity, 0]);
    const cf64 = createIqSampleDecoder(sigmfDatatypeFromName('cf64_be')!);
    expect(captureError(() => cf64.push(inf))).toMatchObject({ byteOffset: 0 });
  });

  it('never throws anything but ImportError on arbitrary bytes and splits (fuzz)', () => {
    const names = ['cf32_le', 'cf32_be', 'cf64_le', 'ci16_le', 'ci8', 'cu8', 'ci32_be'];
    fc.assert(
      fc.property(
        fc.constantFrom(...names),
        fc.uint8Array({ maxLength: 200 }),
        fc.array(fc.nat(200), { maxLength: 6 }),
        (name, bytes, rawCuts) => {
          const cuts = rawCuts.map((c) => Math.min(c, bytes.length)).sort((a, b) => a - b);
          try {
            const got = decodeInChunks(name, bytes, cuts);
            expect(got.i).toHaveLength(bytes.length / sigmfDatatypeFromName(name)!.bytesPerSample);
            expect(got.i.every(Number.isFinite)).toBe(true);
          } catch (error) {
            expect(error).toBeInstanceOf(ImportError);
          }
        },
      ),
      { seed: 20261201, numRuns: 300 },
    );
  });
});

function captureError(action: () => unknown): unknown {
  try {
    action();
  } catch (error) {
    return error;
  }
  return undefined;
}
