import { checkSpurious } from './check-spurious';

describe('checkSpurious', () => {
  // 100 W = 50 dBm reference; 43 + 10·log10(100) = 63 dB required → absolute limit −13 dBm
  // (common practice identity).
  const base = { referencePowerDbm: 50, requiredAttenuationDb: 63 };

  it('gives per-emission attenuation and margin, and the worst emission', () => {
    const r = checkSpurious({
      ...base,
      emissions: [
        { frequencyHz: 4_364_000, levelDbm: -20 }, // 70 dB below, margin +7
        { frequencyHz: 6_546_000, levelDbm: -15 }, // 65 dB below, margin +2
        { frequencyHz: 8_728_000, levelDbm: -40 },
      ],
    });
    expect(r.verdict).toBe('pass');
    expect(r.limitDbm).toBe(-13);
    expect(r.rows.map((row) => row.attenuationDb)).toEqual([70, 65, 90]);
    expect(r.rows.map((row) => row.marginDb)).toEqual([7, 2, 27]);
    expect(r.worstIndex).toBe(1);
    expect(r.worstMarginDb).toBe(2);
    expect(r.worstFrequencyHz).toBe(6_546_000);
  });

  it('fails when any emission is above the absolute limit; exactly at the limit passes', () => {
    const r = checkSpurious({
      ...base,
      emissions: [
        { frequencyHz: 1, levelDbm: -13 },
        { frequencyHz: 2, levelDbm: -12.5 },
      ],
    });
    expect(r.rows[0].pass).toBe(true);
    expect(r.rows[1].pass).toBe(false);
    expect(r.verdict).toBe('fail');
    expect(r.worstMarginDb).toBe(-0.5);
  });

  it('takes the first emission on a tie and accepts one emission', () => {
    const r = checkSpurious({
      ...base,
      emissions: [
        { frequencyHz: 10, levelDbm: -30 },
        { frequencyHz: 20, levelDbm: -30 },
      ],
    });
    expect(r.worstIndex).toBe(0);
    const silent = checkSpurious({ ...base, emissions: [{ frequencyHz: 5, levelDbm: -Infinity }] });
    expect(silent.worstMarginDb).toBe(Infinity);
  });

  it('throws on an empty list or bad values', () => {
    expect(() => checkSpurious({ ...base, emissions: [] })).toThrow(
      /^checkSpurious: emissions is empty/,
    );
    expect(() =>
      checkSpurious({ ...base, emissions: [{ frequencyHz: NaN, levelDbm: 0 }] }),
    ).toThrow(/emissions\[0\]\.frequencyHz/);
    expect(() =>
      checkSpurious({ ...base, emissions: [{ frequencyHz: 1, levelDbm: NaN }] }),
    ).toThrow(RangeError);
    expect(() => checkSpurious({ ...base, referencePowerDbm: Infinity, emissions: [] })).toThrow(
      /referencePowerDbm/,
    );
  });
});
