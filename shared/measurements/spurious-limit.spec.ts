import fc from 'fast-check';
import { spuriousLimitAbsoluteDbm, spuriousLimitDb } from './spurious-limit';

describe('spuriousLimitDb', () => {
  it.each([
    // 43 + 10·log10(P/W): P = 1, 10, 100, 1000 W → 43, 53, 63, 73 dB (common practice arithmetic
    // of the published 47 CFR 80.211(a)(3) formula)
    [1, 43],
    [10, 53],
    [100, 63],
    [1000, 73],
  ])('%p W → %p dB', (meanPowerW, db) => {
    expect(spuriousLimitDb({ meanPowerW })).toBeCloseTo(db, 12);
  });

  it('43 + 10·log10(P) dB below P is always −13 dBm (common practice), property over P (seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e5, noNaN: true }), (meanPowerW) => {
        const requiredAttenuationDb = spuriousLimitDb({ meanPowerW });
        expect(
          spuriousLimitAbsoluteDbm({ referencePowerW: meanPowerW, requiredAttenuationDb }),
        ).toBeCloseTo(-13, 9);
      }),
      { seed: 43, numRuns: 200 },
    );
  });

  it('combines with a fixed dBc figure, whichever is less or more stringent (RR App. 3 wording, from memory)', () => {
    // 1 kW: formula 73 dB. With 70 dBc "whichever is less stringent" → 70 dB.
    expect(spuriousLimitDb({ meanPowerW: 1000, capDbc: 70, capRule: 'less-stringent' })).toBe(70);
    const stricter = spuriousLimitDb({ meanPowerW: 1000, capDbc: 70, capRule: 'more-stringent' });
    expect(stricter).toBeCloseTo(73, 12);
    // 100 W SSB mobile below 30 MHz: 63 dB vs 60 dBc less stringent → 60 dB
    expect(spuriousLimitDb({ meanPowerW: 100, capDbc: 60 })).toBe(60);
    // 10 W: formula 53 dB is already less stringent than 60 dBc
    expect(spuriousLimitDb({ meanPowerW: 10, capDbc: 60 })).toBeCloseTo(53, 12);
  });

  it('accepts another base, e.g. the 60 dB base some rules use', () => {
    expect(spuriousLimitDb({ meanPowerW: 10, baseDb: 60 })).toBeCloseTo(70, 12);
  });

  it('throws with the function name', () => {
    expect(() => spuriousLimitDb({ meanPowerW: 0 })).toThrow(/^spuriousLimitDb: meanPowerW/);
    expect(() => spuriousLimitDb({ meanPowerW: NaN })).toThrow(RangeError);
    expect(() => spuriousLimitDb({ meanPowerW: 1, capDbc: NaN })).toThrow(/capDbc/);
    expect(() =>
      spuriousLimitDb({ meanPowerW: 1, capDbc: 3, capRule: 'other' as 'less-stringent' }),
    ).toThrow(/capRule/);
    expect(() =>
      spuriousLimitAbsoluteDbm({ referencePowerW: -1, requiredAttenuationDb: 1 }),
    ).toThrow(
      /^spuriousLimitAbsoluteDbm: /,
    );
  });
});
