import { imdRelativeDb } from './imd-relative';

describe('imdRelativeDb', () => {
  it('−25 dB re one tone is −31.02 dB re PEP (published practice: re PEP = re tone − 6.02 dB)', () => {
    const r = imdRelativeDb({ productDbm: 15, toneDbm: 40 });
    expect(r.belowToneDb).toBe(25);
    expect(r.belowPepDb).toBeCloseTo(31.02, 2);
  });

  it('uses exact 20·log10(2) = 6.0206 dB between the two references', () => {
    const r = imdRelativeDb({ productDbm: -3, toneDbm: 7 });
    expect(r.belowPepDb - r.belowToneDb).toBeCloseTo(6.020599913279624, 12);
  });

  it('uses a measured PEP when one is given instead of inferring it', () => {
    const r = imdRelativeDb({ productDbm: 10, toneDbm: 43.9, pepDbm: 50 });
    expect(r.belowToneDb).toBeCloseTo(33.9, 12);
    expect(r.belowPepDb).toBe(40);
  });

  it('a product below the noise (-Infinity) is infinitely far below both references', () => {
    expect(imdRelativeDb({ productDbm: -Infinity, toneDbm: 40 })).toEqual({
      belowToneDb: Infinity,
      belowPepDb: Infinity,
    });
  });

  it('throws with the function name', () => {
    expect(() => imdRelativeDb({ productDbm: NaN, toneDbm: 40 })).toThrow(/^imdRelativeDb: /);
    expect(() => imdRelativeDb({ productDbm: 0, toneDbm: -Infinity })).toThrow(RangeError);
    expect(() => imdRelativeDb({ productDbm: 0, toneDbm: 40, pepDbm: NaN })).toThrow(/pepDbm/);
  });
});
