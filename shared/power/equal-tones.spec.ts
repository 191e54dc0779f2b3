import fc from 'fast-check';
import {
  TWO_TONE_MEAN_ABOVE_TONE_DB,
  TWO_TONE_PEP_ABOVE_TONE_DB,
  equalTonesFromToneDbm,
  toneDbmFromTwoTonePepDbm,
  twoToneFromToneDbm,
} from './equal-tones';

describe('two-tone and n-tone relations', () => {
  it('two tones of −10.00 dBm: PEP −3.98 dBm, mean −6.99 dBm (common practice worked check)', () => {
    const { pepDbm, meanDbm } = twoToneFromToneDbm(-10);
    expect(pepDbm).toBeCloseTo(-3.98, 2);
    expect(meanDbm).toBeCloseTo(-6.99, 2);
    expect(pepDbm - meanDbm).toBeCloseTo(3.01, 2);
  });

  it('uses exact 20·log10(2) and 10·log10(2), not 6.02 and 3.01', () => {
    // 20·log10(2) = 6.020599913279624, 10·log10(2) = 3.010299956639812 (hand arithmetic)
    expect(TWO_TONE_PEP_ABOVE_TONE_DB).toBeCloseTo(6.020599913279624, 14);
    expect(TWO_TONE_MEAN_ABOVE_TONE_DB).toBeCloseTo(3.010299956639812, 14);
    expect(twoToneFromToneDbm(0).pepDbm).not.toBe(6.02);
  });

  it.each([
    // [n, mean above tone = 10·log10(n) dB, PEP above tone = 20·log10(n) dB]
    // published: mean = n·Pt, PEP = n²·Pt
    [1, 0, 0],
    [2, 3.0103, 6.0206],
    [3, 4.7712, 9.5424],
    [10, 10, 20],
  ])('%p tones: mean +%p dB, PEP +%p dB', (n, meanAboveDb, pepAboveDb) => {
    const r = equalTonesFromToneDbm(20, n);
    expect(r.meanDbm - 20).toBeCloseTo(meanAboveDb, 4);
    expect(r.pepDbm - 20).toBeCloseTo(pepAboveDb, 4);
  });

  it('agrees with the time-domain envelope of two equal tones (independent path)', () => {
    // x(t) = e^{jω1 t} + e^{jω2 t}, unit tones; crest |x|² = 4 at t = 0, mean |x|² = 2.
    let peak = 0;
    let sum = 0;
    const n = 4800;
    for (let k = 0; k < n; k++) {
      const t = k / 48000;
      const re = Math.cos(2 * Math.PI * 1100 * t) + Math.cos(2 * Math.PI * 1700 * t);
      const im = Math.sin(2 * Math.PI * 1100 * t) + Math.sin(2 * Math.PI * 1700 * t);
      const p = re * re + im * im;
      peak = Math.max(peak, p);
      sum += p;
    }
    const r = twoToneFromToneDbm(0);
    expect(10 * Math.log10(peak)).toBeCloseTo(r.pepDbm, 9);
    expect(10 * Math.log10(sum / n)).toBeCloseTo(r.meanDbm, 9);
  });

  it('toneDbmFromTwoTonePepDbm inverts twoToneFromToneDbm (property, seeded)', () => {
    fc.assert(
      fc.property(fc.double({ min: -150, max: 80, noNaN: true }), (toneDbm) => {
        expect(toneDbmFromTwoTonePepDbm(twoToneFromToneDbm(toneDbm).pepDbm)).toBeCloseTo(
          toneDbm,
          10,
        );
      }),
      { seed: 2, numRuns: 100 },
    );
  });

  it('throws with the function name on bad input', () => {
    expect(() => twoToneFromToneDbm(NaN)).toThrow(/^twoToneFromToneDbm: /);
    expect(() => twoToneFromToneDbm(-Infinity)).toThrow(RangeError);
    expect(() => equalTonesFromToneDbm(0, 0)).toThrow(/^equalTonesFromToneDbm: toneCount/);
    expect(() => equalTonesFromToneDbm(0, 2.5)).toThrow(RangeError);
    expect(() => toneDbmFromTwoTonePepDbm(Infinity)).toThrow(/^toneDbmFromTwoTonePepDbm: /);
  });
});
