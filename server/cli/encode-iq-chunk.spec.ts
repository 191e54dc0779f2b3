import { createIqSampleDecoder } from '../../shared/import/iq-sample-decoder';
import { sigmfDatatypeFromName } from '../../shared/import/sigmf-datatype';
import { encodeIqChunk } from './encode-iq-chunk';

describe('encodeIqChunk', () => {
  it('writes ci16_le codes round(v * 32768), clipped, I before Q', () => {
    const bytes = encodeIqChunk(Float32Array.of(0.5, 1), Float32Array.of(-1, -0.25), 'ci16_le');
    // 0.5 -> 16384 = 0x4000; -1 -> -32768 = 0x8000; 1 clips to 32767 = 0x7fff; -0.25 -> 0xe000.
    expect([...bytes]).toEqual([0x00, 0x40, 0x00, 0x80, 0xff, 0x7f, 0x00, 0xe0]);
  });

  it('round-trips through the importer: cf32_le exactly, ci16_le within half a code', () => {
    const i = Float32Array.from({ length: 257 }, (_, k) => Math.sin(k / 7) * 0.9);
    const q = Float32Array.from({ length: 257 }, (_, k) => Math.cos(k / 5) * 0.9);
    const decode = (name: 'cf32_le' | 'ci16_le') =>
      createIqSampleDecoder(sigmfDatatypeFromName(name)!).push(encodeIqChunk(i, q, name));
    const cf32 = decode('cf32_le');
    expect(cf32.i).toEqual(i);
    expect(cf32.q).toEqual(q);
    const ci16 = decode('ci16_le');
    ci16.i.forEach((v, k) => expect(Math.abs(v - i[k])).toBeLessThanOrEqual(0.5 / 32768 + 1e-9));
    ci16.q.forEach((v, k) => expect(Math.abs(v - q[k])).toBeLessThanOrEqual(0.5 / 32768 + 1e-9));
  });

  it('refuses I and Q of different lengths', () => {
    const encode = () => encodeIqChunk(new Float32Array(2), new Float32Array(1), 'cf32_le');
    expect(encode).toThrow(/^encodeIqChunk:/);
  });
});
