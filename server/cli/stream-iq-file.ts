import fs from 'node:fs/promises';
import { ImportError } from '../../shared/import/import-error';
import { createIqSampleDecoder } from '../../shared/import/iq-sample-decoder';
import type { IqSource } from './open-iq-source';

/** Read size: large enough that system calls do not dominate, small enough to bound memory. */
export const IQ_READ_CHUNK_BYTES = 1 << 20;

/**
 * Streams the samples of an I/Q source through `consume` in fixed-size reads (one reused
 * buffer: memory stays bounded whatever the file size). Decoding errors (NaN samples, a
 * truncated last sample) surface as ImportError with the file byte offset.
 *
 * @returns the number of complex samples delivered.
 */
export async function streamIqFile(
  source: IqSource,
  consume: (i: Float32Array, q: Float32Array) => void,
): Promise<number> {
  const decoder = createIqSampleDecoder(source.datatype, { baseByteOffset: source.dataOffset });
  const handle = await fs.open(source.dataPath, 'r');
  try {
    const buffer = new Uint8Array(IQ_READ_CHUNK_BYTES);
    let position = source.dataOffset;
    const end = source.dataOffset + source.dataLengthBytes;
    while (position < end) {
      const want = Math.min(buffer.length, end - position);
      const { bytesRead } = await handle.read(buffer, 0, want, position);
      if (bytesRead === 0) {
        const detail = `file ends at byte ${position}; ${end} bytes of samples were expected`;
        throw new ImportError('streamIqFile', detail, { byteOffset: position });
      }
      position += bytesRead;
      const chunk = decoder.push(buffer.subarray(0, bytesRead));
      if (chunk.i.length > 0) consume(chunk.i, chunk.q);
    }
    decoder.finish();
    return decoder.sampleCount;
  } finally {
    await handle.close();
  }
}
