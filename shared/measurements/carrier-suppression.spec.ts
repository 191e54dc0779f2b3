import { carrierSuppressionDb } from './carrier-suppression';

describe('carrierSuppressionDb', () => {
  it.each([
    // [pepDbm, carrierDbm, suppression dB] — S = PEP − carrier, limits stated as "dB below PEP"
    // (47 CFR 80.207(c), published). 100 W PEP = 50 dBm by definition of dBm.
    [50, 10, 40], // exactly the maritime J3E limit of 40 dB below PEP
    [50, 24, 26], // exactly the aircraft limit of 26 dB, 47 CFR 87.141(d)
    [60, 5.5, 54.5],
  ])('PEP %p dBm, carrier %p dBm → %p dB', (pepDbm, carrierDbm, db) => {
    expect(carrierSuppressionDb({ pepDbm, carrierDbm })).toBeCloseTo(db, 12);
  });

  it('is negative when the carrier is above PEP (an impossible reading flags a set-up error)', () => {
    expect(carrierSuppressionDb({ pepDbm: 40, carrierDbm: 41 })).toBe(-1);
  });

  it('no measurable carrier (-Infinity dBm) is infinite suppression', () => {
    expect(carrierSuppressionDb({ pepDbm: 50, carrierDbm: -Infinity })).toBe(Infinity);
  });

  it('throws on non-finite PEP or NaN carrier', () => {
    expect(() => carrierSuppressionDb({ pepDbm: NaN, carrierDbm: 0 })).toThrow(
      /^carrierSuppressionDb: pepDbm/,
    );
    expect(() => carrierSuppressionDb({ pepDbm: 50, carrierDbm: NaN })).toThrow(RangeError);
    expect(() => carrierSuppressionDb({ pepDbm: 50, carrierDbm: Infinity })).toThrow(RangeError);
  });
});
