import { TWO_TONE_TEST_PAIRS_47CFR_2_1049, twoToneTestPairFor } from './two-tone-test-tones';

describe('47 CFR 2.1049 two-tone test pairs (published)', () => {
  it.each([
    [3000, 400, 1800],
    [3500, 500, 2100],
    [4000, 500, 2400],
  ])('authorized bandwidth %p Hz → %p + %p Hz', (bw, f1, f2) => {
    expect(twoToneTestPairFor(bw)).toEqual({ authorizedBandwidthHz: bw, tone1Hz: f1, tone2Hz: f2 });
  });

  it('each pair lies inside its authorized bandwidth', () => {
    for (const pair of TWO_TONE_TEST_PAIRS_47CFR_2_1049) {
      expect(pair.tone1Hz).toBeLessThan(pair.tone2Hz);
      expect(pair.tone2Hz).toBeLessThan(pair.authorizedBandwidthHz);
    }
  });

  it('is frozen data', () => {
    expect(Object.isFrozen(TWO_TONE_TEST_PAIRS_47CFR_2_1049)).toBe(true);
  });

  it('throws for a bandwidth the rule does not list, or a bad value', () => {
    expect(() => twoToneTestPairFor(2700)).toThrow(
      /^twoToneTestPairFor: 47 CFR 2.1049 lists no pair for 2700 Hz \(listed: 3000, 3500, 4000/,
    );
    expect(() => twoToneTestPairFor(0)).toThrow(RangeError);
    expect(() => twoToneTestPairFor(NaN)).toThrow(RangeError);
  });
});
