import type { EmissionMask } from './emission-mask';
import { maskLimitAtOffset } from './mask-limit-at-offset';

// Limit semantics (common practice reading of the "more than X up to and including Y" wording of
// 47 CFR 80.211 / 87.139): linear in dB over Hz between vertices, less stringent value exactly at
// a step, first value inside the first vertex, last value beyond the last.
describe('maskLimitAtOffset', () => {
  const stepped: EmissionMask = {
    reference: 'mean',
    vertices: [
      [1500, 0],
      [1500, -28],
      [4500, -28],
      [4500, -35],
      [7500, -35],
      [7500, -63],
    ],
  };
  const sloped: EmissionMask = {
    reference: 'pep',
    vertices: [
      [1000, -3],
      [2000, -43],
      [3000, -53],
    ],
  };

  it.each([
    [0, 0],
    [1499.999, 0],
    [1500, 0], // step: the higher value holds exactly at the step
    [1500.001, -28],
    [4500, -28], // exactly 150 % of 3 kHz is in the 28 dB region
    [4500.001, -35],
    [7500, -35],
    [7500.001, -63],
    [1e9, -63],
  ])('stepped mask at %p Hz → %p dB', (offsetHz, relDb) => {
    expect(maskLimitAtOffset(stepped, offsetHz)).toBe(relDb);
  });

  it.each([
    [0, -3], // the first value holds inside the first vertex
    [1000, -3],
    [1500, -23], // halfway between −3 and −43
    [1750, -33],
    [2000, -43],
    [2500, -48],
    [3000, -53],
    [10_000, -53],
  ])('sloped mask at %p Hz → %p dB (linear in dB over Hz)', (offsetHz, relDb) => {
    expect(maskLimitAtOffset(sloped, offsetHz)).toBeCloseTo(relDb, 12);
  });

  it('is symmetric in the sign of the offset', () => {
    for (const offsetHz of [0, 700, 1500, 1500.5, 2333, 4500, 9000]) {
      expect(maskLimitAtOffset(stepped, -offsetHz)).toBe(maskLimitAtOffset(stepped, offsetHz));
      expect(maskLimitAtOffset(sloped, -offsetHz)).toBe(maskLimitAtOffset(sloped, offsetHz));
    }
  });

  it('a step up (outer less stringent) holds the outer value exactly at the step', () => {
    const mask: EmissionMask = {
      reference: 'pep',
      vertices: [
        [100, -50],
        [200, -50],
        [200, -20],
      ],
    };
    expect(maskLimitAtOffset(mask, 200)).toBe(-20);
    expect(maskLimitAtOffset(mask, 199.999)).toBe(-50);
  });

  it('a one-vertex mask is flat everywhere', () => {
    const mask: EmissionMask = { reference: 'pep', vertices: [[2000, -40]] };
    expect(maskLimitAtOffset(mask, 0)).toBe(-40);
    expect(maskLimitAtOffset(mask, 5e6)).toBe(-40);
  });

  it.each([
    ['no vertices', { reference: 'pep', vertices: [] }, /has no vertices/],
    ['a positive limit', { reference: 'pep', vertices: [[0, 1]] }, /relDb must be finite and ≤ 0/],
    ['a negative offset', { reference: 'pep', vertices: [[-1, 0]] }, /offset must be finite/],
    ['decreasing offsets', { reference: 'pep', vertices: [[2, 0], [1, -1]] }, /below the previous/],
    [
      'three at one offset',
      { reference: 'pep', vertices: [[1, 0], [1, -1], [1, -2]] },
      /more than two/,
    ],
    ['a step at 0', { reference: 'pep', vertices: [[0, 0], [0, -5]] }, /step at offset 0/],
    ['a bad reference', { reference: 'carrier', vertices: [[0, 0]] }, /reference must be/],
    ['NaN limit', { reference: 'pep', vertices: [[0, NaN]] }, /relDb/],
  ])('throws on %s', (_, mask, message) => {
    expect(() => maskLimitAtOffset(mask as unknown as EmissionMask, 0)).toThrow(message);
    expect(() => maskLimitAtOffset(mask as unknown as EmissionMask, 0)).toThrow(
      /^maskLimitAtOffset: /,
    );
  });

  it('throws on a non-finite offset and a malformed mask', () => {
    expect(() => maskLimitAtOffset(stepped, NaN)).toThrow(RangeError);
    expect(() => maskLimitAtOffset(stepped, Infinity)).toThrow(/^maskLimitAtOffset: offsetHz/);
    expect(() => maskLimitAtOffset({} as EmissionMask, 0)).toThrow(TypeError);
  });
});
