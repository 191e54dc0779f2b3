import { defaultSegmentLength } from './default-segment-length';

describe('defaultSegmentLength', () => {
  it.each([
    // Smallest power of two with Hann noise bandwidth 1.5·fs/N ≤ 30 Hz (Harris 1978 ENBW;
    // 10–30 Hz carrier RBW, common practice): N ≥ fs/20.
    [192000, 16384], // 9600 → 16384: 11.72 Hz bins, 17.6 Hz noise bandwidth
    [48000, 4096], // 2400 → 4096
    [8000, 512], // 400 → 512
    [320, 16], // exactly 16: 1.5·20 = 30 Hz is allowed
    [100, 16], // floor of the range
    [10e6, 131072], // ceiling of the range
  ])('%i S/s → %i', (fs, expected) => {
    expect(defaultSegmentLength(fs)).toBe(expected);
  });

  it('rejects a non-positive rate', () => {
    expect(() => defaultSegmentLength(0)).toThrow(/^defaultSegmentLength: sampleRateHz/);
  });
});
