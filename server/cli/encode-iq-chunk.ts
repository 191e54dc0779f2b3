/** Sample formats the `synthesize` command writes. */
export type WritableDatatype = 'cf32_le' | 'ci16_le';

/**
 * Interleaves I and Q into the bytes of a SigMF dataset (I first). ci16_le stores
 * round(v * 32768) clipped to -32768..32767, the inverse of the importers' v / 32768.
 * Little-endian is written explicitly (DataView), whatever the machine's byte order.
 *
 * @example encodeIqChunk(Float32Array.of(0.5), Float32Array.of(-1), 'ci16_le') // bytes 00 40 00 80
 */
export function encodeIqChunk(
  i: Float32Array,
  q: Float32Array,
  datatype: WritableDatatype,
): Uint8Array {
  if (i.length !== q.length) throw new RangeError('encodeIqChunk: i and q lengths differ');
  const componentBytes = datatype === 'cf32_le' ? 4 : 2;
  const bytes = new Uint8Array(i.length * 2 * componentBytes);
  const view = new DataView(bytes.buffer);
  if (datatype === 'cf32_le') {
    for (let k = 0; k < i.length; k++) {
      view.setFloat32(8 * k, i[k], true);
      view.setFloat32(8 * k + 4, q[k], true);
    }
    return bytes;
  }
  const code = (v: number) => Math.max(-32768, Math.min(32767, Math.round(v * 32768)));
  for (let k = 0; k < i.length; k++) {
    view.setInt16(4 * k, code(i[k]), true);
    view.setInt16(4 * k + 2, code(q[k]), true);
  }
  return bytes;
}
