import { maskLimitLine } from './mask-limit-line';
import { SAMPLE_RULE_SETS } from '../../shared/rules/sample-rule-sets';

describe('maskLimitLine', () => {
  it('draws the maritime sample mask (47 CFR 80.211(a), 3.0 kHz) about 2182 kHz at 47 dBm mean power', () => {
    const mask = SAMPLE_RULE_SETS.find((r) => r.key === 'us-maritime-hf-ssb')!.body.limits.emissionMask!;
    const line = maskLimitLine(mask, 2_182_000, 47, 10_000);
    // Steps at 150 % and 250 % of the authorized bandwidth: 28 dB, 35 dB, then 63 dB (100 W) below mean.
    expect(line.upper.x).toEqual([2_183_500, 2_183_500, 2_186_500, 2_186_500, 2_189_500, 2_189_500, 2_192_000]);
    expect(line.upper.y).toEqual([47, 19, 19, 12, 12, -16, -16]);
    expect(line.lower.x[0]).toBe(2_180_500);
    expect(line.lower.x.at(-1)).toBe(2_172_000);
  });
});
