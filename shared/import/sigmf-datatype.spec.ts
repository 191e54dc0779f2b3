import { isRealSigmfDatatype, sigmfDatatypeFromName } from './sigmf-datatype';

// Datatype grammar: SigMF specification v1.x, "Dataset Format" (c|r, type, _le/_be for > 8 bits).
describe('sigmfDatatypeFromName', () => {
  it.each([
    ['cf32_le', 8, true, true],
    ['cf32_be', 8, false, true],
    ['cf64_le', 16, true, true],
    ['ci32_le', 8, true, false],
    ['ci16_le', 4, true, false],
    ['ci16_be', 4, false, false],
    ['cu16_le', 4, true, false],
    ['ci8', 2, true, false],
    ['cu8', 2, true, false],
  ])('reads %s as %i bytes per complex sample', (name, bytes, littleEndian, isFloat) => {
    const datatype = sigmfDatatypeFromName(name);
    expect(datatype).toMatchObject({ name, bytesPerSample: bytes, littleEndian, isFloat });
  });

  it.each(['cf32', 'ci16', 'cu8_le', 'ci8_be', 'rf32_le', 'cf16_le', 'CF32_LE', '', 'cf32_le '])(
    'refuses %j (missing/superfluous endianness, real or unknown type)',
    (name) => {
      expect(sigmfDatatypeFromName(name)).toBeUndefined();
    },
  );

  // Normalization is our documented choice: signed N-bit / 2^(N-1); unsigned about mid-code.
  it('maps ci16 codes by v / 32768 and cu8 codes by (v - 127.5) / 127.5', () => {
    const ci16 = sigmfDatatypeFromName('ci16_le')!;
    expect((-32768 - ci16.offset) * ci16.scale).toBe(-1);
    expect((16384 - ci16.offset) * ci16.scale).toBe(0.5);
    const cu8 = sigmfDatatypeFromName('cu8')!;
    expect((255 - cu8.offset) * cu8.scale).toBe(1);
    expect((0 - cu8.offset) * cu8.scale).toBe(-1);
    expect((127.5 - cu8.offset) * cu8.scale).toBe(0);
    const ci8 = sigmfDatatypeFromName('ci8')!;
    expect((-128 - ci8.offset) * ci8.scale).toBe(-1);
  });

  it('tells real-valued SigMF types apart from unknown names', () => {
    expect(isRealSigmfDatatype('rf32_le')).toBe(true);
    expect(isRealSigmfDatatype('ri16_le')).toBe(true);
    expect(isRealSigmfDatatype('cf32_le')).toBe(false);
    expect(isRealSigmfDatatype('bogus')).toBe(false);
  });
});
