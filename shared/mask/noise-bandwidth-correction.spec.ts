import { noiseBandwidthCorrectionDb } from './noise-bandwidth-correction';

describe('noiseBandwidthCorrectionDb (noise-like emissions scale as 10·log10(B2/B1), published)', () => {
  it.each([
    [4000, 300, 11.25], // published example: 300 Hz → 4 kHz is +11.25 dB
    [10_000, 1000, 10],
    [100, 1000, -10],
    [3000, 3000, 0],
  ])('%p Hz from %p Hz → %p dB', (referenceHz, rbwHz, db) => {
    expect(noiseBandwidthCorrectionDb(referenceHz, rbwHz)).toBeCloseTo(db, 2);
  });

  it('throws on non-positive or non-finite bandwidths', () => {
    expect(() => noiseBandwidthCorrectionDb(0, 300)).toThrow(
      /^noiseBandwidthCorrectionDb: referenceBandwidthHz/,
    );
    expect(() => noiseBandwidthCorrectionDb(4000, -1)).toThrow(/rbwHz/);
    expect(() => noiseBandwidthCorrectionDb(NaN, 300)).toThrow(RangeError);
  });
});
