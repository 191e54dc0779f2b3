import { ImportError } from './import-error';
import type { SampleComponentType, SigmfDatatype } from './sigmf-datatype';

/** One decoded block of complex samples, normalized to full scale 1.0. */
export interface IqChunk {
  i: Float32Array;
  q: Float32Array;
}

/** A streaming decoder: push byte chunks of any size, get whole samples back. */
export interface IqSampleDecoder {
  /** Decodes every whole sample now available; keeps a partial sample for the next chunk. */
  push(bytes: Uint8Array): IqChunk;
  /** Ends the stream; throws ImportError if a partial sample is left over. */
  finish(): void;
  /** Samples returned so far. */
  readonly sampleCount: number;
}

type ComponentReader = (view: DataView, byteOffset: number, littleEndian: boolean) => number;

const READERS: Record<SampleComponentType, ComponentReader> = {
  f32: (v, o, le) => v.getFloat32(o, le),
  f64: (v, o, le) => v.getFloat64(o, le),
  i32: (v, o, le) => v.getInt32(o, le),
  i16: (v, o, le) => v.getInt16(o, le),
  i8: (v, o) => v.getInt8(o),
  u32: (v, o, le) => v.getUint32(o, le),
  u16: (v, o, le) => v.getUint16(o, le),
  u8: (v, o) => v.getUint8(o),
};

/**
 * Creates a streaming decoder for interleaved I/Q bytes (I first, as in SigMF, and as in a
 * two-channel WAV file with I on the left channel). Chunks may split a sample anywhere; the
 * decoder carries the partial bytes over. Scaling: `(raw - datatype.offset) * datatype.scale`,
 * see `sigmfDatatypeFromName`.
 *
 * Bad data: a NaN or infinite float component throws ImportError naming its byte offset; bytes
 * left over at `finish()` (a truncated file) throw ImportError naming where the partial sample
 * starts. Offsets count from `baseByteOffset` (the position of the first data byte in the file).
 *
 * @param datatype from `sigmfDatatypeFromName`, `wavSampleDatatype` or `rawIqDatatype`.
 * @param options.baseByteOffset file offset of the first byte pushed (default 0).
 * @example
 * const d = createIqSampleDecoder(sigmfDatatypeFromName('ci16_le')!);
 * d.push(new Uint8Array([0, 0x40, 0]));  // { i: [], q: [] } (3 of 4 bytes)
 * d.push(new Uint8Array([0xc0]));        // { i: [0.5], q: [-0.5] }
 */
export function createIqSampleDecoder(
  datatype: SigmfDatatype,
  options: { baseByteOffset?: number } = {},
): IqSampleDecoder {
  const bytesPerSample = datatype.bytesPerSample;
  const half = datatype.bytesPerComponent;
  const { littleEndian, isFloat, offset, scale } = datatype;
  const read = READERS[datatype.componentType];
  const pending = new Uint8Array(bytesPerSample);
  const pendingView = new DataView(pending.buffer);
  let pendingLength = 0;
  let consumedBytes = options.baseByteOffset ?? 0;
  let sampleCount = 0;

  function check(value: number, byteOffset: number): number {
    // Integer types cannot hold NaN; a float NaN or Inf would poison every power sum downstream.
    if (isFloat && value - value !== 0) {
      throw new ImportError('decodeIqSamples', `sample component is ${value}`, { byteOffset });
    }
    return (value - offset) * scale;
  }

  function push(bytes: Uint8Array): IqChunk {
    let start = 0;
    let carried = 0;
    if (pendingLength > 0) {
      start = Math.min(bytesPerSample - pendingLength, bytes.length);
      pending.set(bytes.subarray(0, start), pendingLength);
      pendingLength += start;
      if (pendingLength < bytesPerSample) {
        consumedBytes += start;
        return { i: new Float32Array(0), q: new Float32Array(0) };
      }
      carried = 1;
    }
    const whole = Math.floor((bytes.length - start) / bytesPerSample);
    const i = new Float32Array(carried + whole);
    const q = new Float32Array(carried + whole);
    if (carried === 1) {
      const at = consumedBytes - (bytesPerSample - start);
      i[0] = check(read(pendingView, 0, littleEndian), at);
      q[0] = check(read(pendingView, half, littleEndian), at + half);
      pendingLength = 0;
    }
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    const fileBase = consumedBytes;
    for (let k = 0, at = start; k < whole; k++, at += bytesPerSample) {
      i[carried + k] = check(read(view, at, littleEndian), fileBase + at);
      q[carried + k] = check(read(view, at + half, littleEndian), fileBase + at + half);
    }
    const used = start + whole * bytesPerSample;
    pending.set(bytes.subarray(used), 0);
    pendingLength = bytes.length - used;
    consumedBytes += bytes.length;
    sampleCount += carried + whole;
    return { i, q };
  }

  function finish(): void {
    if (pendingLength > 0) {
      throw new ImportError(
        'decodeIqSamples',
        `data ends inside a sample: ${pendingLength} trailing byte(s) of a ` +
          `${bytesPerSample}-byte ${datatype.name} sample (truncated file?)`,
        { byteOffset: consumedBytes - pendingLength },
      );
    }
  }

  return {
    push,
    finish,
    get sampleCount() {
      return sampleCount;
    },
  };
}
