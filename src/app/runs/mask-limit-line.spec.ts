import { maskLimitLine, type MaskLine } from './mask-limit-line';

// 47 CFR 80.211(a) with an authorized bandwidth of 3.0 kHz (offsets from memory): more than 50 % to
// 150 % (1.5–4.5 kHz) at least 28 dB below mean power; more than 150 % to 250 % (4.5–7.5 kHz) 35 dB;
// beyond, 43 + 10 log10(P/W) dB — 63 dB for P = 100 W (the −13 dBm absolute level, common practice).
const maritime: MaskLine = {
  assignedHz: 2_182_000,
  referenceDbm: 50, // 100 W mean power
  exemptWithinOffsetHz: 1500,
  segments: [
    { fromOffsetHz: 0, toOffsetHz: 1500, fromRelDb: 0, toRelDb: 0 },
    { fromOffsetHz: 1500, toOffsetHz: 4500, fromRelDb: -28, toRelDb: -28 },
    { fromOffsetHz: 4500, toOffsetHz: 7500, fromRelDb: -35, toRelDb: -35 },
    { fromOffsetHz: 7500, toOffsetHz: null, fromRelDb: -63, toRelDb: -63 },
  ],
};

describe('maskLimitLine', () => {
  it('places each region of the maritime mask on both sides of the assigned frequency', () => {
    const f = [2_182_000 + 1000, 2_182_000 + 2000, 2_182_000 - 2000, 2_182_000 + 6000, 2_182_000 - 10_000];
    expect(maskLimitLine(f, maritime)).toEqual([null, 22, 22, 15, -13]);
  });

  it('gives the less stringent value exactly at a boundary ("up to and including")', () => {
    // At exactly 150 % (4.5 kHz) the 28 dB region still holds; at 250 % (7.5 kHz) the 35 dB one.
    expect(maskLimitLine([2_182_000 + 4500, 2_182_000 + 7500, 2_182_000 - 1500], maritime)).toEqual([22, 15, 50]);
  });

  it('interpolates a sloped segment linearly in dB over Hz', () => {
    const sloped: MaskLine = { assignedHz: 0, referenceDbm: 0, exemptWithinOffsetHz: 0, segments: [{ fromOffsetHz: 1000, toOffsetHz: 3000, fromRelDb: -20, toRelDb: -40 }] };
    expect(maskLimitLine([1000, 2000, 2500, 500, 3500], sloped)).toEqual([-20, -30, -35, null, null]);
  });

  it('is empty-safe', () => {
    expect(maskLimitLine([], maritime)).toEqual([]);
    expect(maskLimitLine([1, 2], { ...maritime, segments: [] })).toEqual([null, null]);
  });
});
