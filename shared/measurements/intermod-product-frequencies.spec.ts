import { intermodProductFrequencies } from './intermod-product-frequencies';

describe('intermodProductFrequencies', () => {
  it('tones 1100/1700 Hz → IM3 500 & 2300 Hz, IM5 −100 & 2900 Hz (common practice)', () => {
    expect(intermodProductFrequencies({ tone1Hz: 1100, tone2Hz: 1700, order: 3 })).toEqual({
      lowerHz: 500,
      upperHz: 2300,
    });
    expect(intermodProductFrequencies({ tone1Hz: 1100, tone2Hz: 1700, order: 5 })).toEqual({
      lowerHz: -100,
      upperHz: 2900,
    });
  });

  it('47 CFR 2.1049 pair 400/1800 Hz: IM3 at 2·400 − 1800 = −1000 and 2·1800 − 400 = 3200 Hz', () => {
    // independent form m·f1 − (m−1)·f2 (arithmetic)
    expect(intermodProductFrequencies({ tone1Hz: 400, tone2Hz: 1800, order: 3 })).toEqual({
      lowerHz: 2 * 400 - 1800,
      upperHz: 2 * 1800 - 400,
    });
    expect(intermodProductFrequencies({ tone1Hz: 400, tone2Hz: 1800, order: 5 })).toEqual({
      lowerHz: 3 * 400 - 2 * 1800,
      upperHz: 3 * 1800 - 2 * 400,
    });
  });

  it('does not depend on the order the tones are given in; works at RF', () => {
    expect(intermodProductFrequencies({ tone1Hz: 1700, tone2Hz: 1100, order: 3 })).toEqual({
      lowerHz: 500,
      upperHz: 2300,
    });
    const rf = intermodProductFrequencies({ tone1Hz: 2_183_100, tone2Hz: 2_183_700, order: 3 });
    expect(rf).toEqual({ lowerHz: 2_182_500, upperHz: 2_184_300 });
  });

  it('throws on equal tones, a bad order or non-finite tones', () => {
    expect(() => intermodProductFrequencies({ tone1Hz: 1000, tone2Hz: 1000, order: 3 })).toThrow(
      /^intermodProductFrequencies: the two tones must differ/,
    );
    expect(() =>
      intermodProductFrequencies({ tone1Hz: 1, tone2Hz: 2, order: 7 as unknown as 3 }),
    ).toThrow(/order must be 3 or 5/);
    expect(() => intermodProductFrequencies({ tone1Hz: NaN, tone2Hz: 2, order: 3 })).toThrow(
      RangeError,
    );
  });
});
