import fc from 'fast-check';
import { occupiedBandwidthFromPowers, occupiedBandwidthFromTrace } from './occupied-bandwidth';

/** 10 Hz bins centred 5, 15, … over 0–5000 Hz with unit power between 300 and 2700 Hz. */
function flatBand(): { f: Float64Array; p: Float64Array } {
  const f = Float64Array.from({ length: 500 }, (_, i) => 5 + 10 * i);
  const p = Float64Array.from(f, (hz) => (hz > 300 && hz < 2700 ? 1 : 0));
  return { f, p };
}

describe('occupiedBandwidthFromPowers (RR 1.153: 0.5 % of the power beyond each limit)', () => {
  it('a flat band 300–2700 Hz occupies 2376 Hz (common practice: 0.99 × 2400)', () => {
    const { f, p } = flatBand();
    const r = occupiedBandwidthFromPowers(f, p);
    expect(r.bandwidthHz).toBeCloseTo(2376, 9);
    expect(r.lowerHz).toBeCloseTo(312, 9); // 300 + 0.005 × 2400
    expect(r.upperHz).toBeCloseTo(2688, 9);
  });

  it('interpolates within a bin, treating its power as uniform (hand arithmetic)', () => {
    // bins 0, 1000, 2000 Hz span −500…2500 Hz; 0.01 of the 2 units lies in each outer bin's tail
    const r = occupiedBandwidthFromPowers([0, 1000, 2000], [1, 0, 1]);
    expect(r.lowerHz).toBeCloseTo(-490, 9);
    expect(r.upperHz).toBeCloseTo(2490, 9);
    expect(r.bandwidthHz).toBeCloseTo(2980, 9);
  });

  it('a Gaussian spectrum occupies 2 × 2.5758 σ (normal quantile z(0.995), A&S Table 26.1)', () => {
    const sigmaHz = 400;
    const stepHz = 2; // σ/200: the piecewise-uniform error is far below the tolerance
    const f = Float64Array.from({ length: 4001 }, (_, i) => 1e6 + (i - 2000) * stepHz);
    const p = Float64Array.from(f, (hz) => Math.exp(-(((hz - 1e6) / sigmaHz) ** 2) / 2));
    const r = occupiedBandwidthFromPowers(f, p);
    expect(r.bandwidthHz / sigmaHz).toBeCloseTo(2 * 2.5758293035489, 3);
    expect((r.lowerHz + r.upperHz) / 2).toBeCloseTo(1e6, 6);
  });

  it('honours another fraction: half the power of a flat band is half its width', () => {
    const { f, p } = flatBand();
    expect(occupiedBandwidthFromPowers(f, p, { fraction: 0.5 }).bandwidthHz).toBeCloseTo(1200, 9);
  });

  it('does not change when every power is scaled (property, seeded)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 80 }),
        fc.double({ min: 1e-12, max: 1e12, noNaN: true }),
        (powers, scale) => {
          fc.pre(powers.some((x) => x > 1e-6));
          const f = powers.map((_, i) => 1000 + 25 * i);
          const a = occupiedBandwidthFromPowers(f, powers);
          const b = occupiedBandwidthFromPowers(f, powers.map((x) => x * scale));
          expect(b.lowerHz).toBeCloseTo(a.lowerHz, 6);
          expect(b.upperHz).toBeCloseTo(a.upperHz, 6);
        },
      ),
      { seed: 1153, numRuns: 300 },
    );
  });

  it('mirrors exactly: a reversed spectrum on mirrored bins has the same width (property, seeded)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 2, maxLength: 80 }),
        (powers) => {
          fc.pre(powers.some((x) => x > 1e-6));
          const f = powers.map((_, i) => 8 * i);
          const a = occupiedBandwidthFromPowers(f, powers);
          const mirrored = f.map((hz) => -hz).reverse();
          const b = occupiedBandwidthFromPowers(mirrored, [...powers].reverse());
          expect(b.lowerHz).toBeCloseTo(-a.upperHz, 9);
          expect(b.upperHz).toBeCloseTo(-a.lowerHz, 9);
        },
      ),
      { seed: 99, numRuns: 300 },
    );
  });

  it('a single non-zero bin occupies 0.99 of its width', () => {
    const r = occupiedBandwidthFromPowers([100, 200, 300], [0, 5, 0]);
    expect(r.bandwidthHz).toBeCloseTo(99, 9);
  });

  it.each([
    ['empty arrays', [], [], undefined, /at least two bins/],
    ['one bin', [1], [1], undefined, /at least two bins/],
    ['mismatched lengths', [1, 2], [1], undefined, /lengths differ/],
    ['unsorted bins', [2, 1], [1, 1], undefined, /strictly ascending/],
    ['repeated bins', [1, 1], [1, 1], undefined, /strictly ascending/],
    ['a NaN power', [1, 2], [1, NaN], undefined, /power\[1\]/],
    ['a negative power', [1, 2], [1, -1], undefined, /power\[1\]/],
    ['an infinite power', [1, 2], [Infinity, 1], undefined, /power\[0\]/],
    ['zero total power', [1, 2], [0, 0], undefined, /total power is zero/],
    ['fraction 1', [1, 2], [1, 1], { fraction: 1 }, /fraction must be between 0 and 1/],
    ['fraction NaN', [1, 2], [1, 1], { fraction: NaN }, /fraction/],
  ])('throws on %s', (_, f, p, options, message) => {
    const run = () => occupiedBandwidthFromPowers(f, p, options);
    expect(run).toThrow(message);
    expect(run).toThrow(/^occupiedBandwidthFromPowers: /);
  });
});

describe('occupiedBandwidthFromTrace', () => {
  it('converts dBm to linear power first: a flat −80 dBm band 300–2700 Hz gives 2376 Hz', () => {
    const { f, p } = flatBand();
    const levels = Float64Array.from(p, (x) => (x > 0 ? -80 : -Infinity));
    expect(occupiedBandwidthFromTrace(f, levels).bandwidthHz).toBeCloseTo(2376, 9);
  });

  it('works at levels that would underflow in milliwatts (−400 dBm)', () => {
    const { f, p } = flatBand();
    const levels = Float64Array.from(p, (x) => (x > 0 ? -400 : -500));
    expect(occupiedBandwidthFromTrace(f, levels).bandwidthHz).toBeCloseTo(2376, 6);
  });

  it('a 20 dB higher band edge shifts power as 100:1 in linear units, not 20:1', () => {
    // two bins of equal width; the upper holds 100× the power: lower limit falls in the upper bin
    const r = occupiedBandwidthFromTrace([0, 10], [-20, 0]);
    // total 1.01; tail 0.00505: lower bin power 0.01 → limit at −5 + 0.505 × 10 Hz
    expect(r.lowerHz).toBeCloseTo(-5 + (0.00505 / 0.01) * 10, 9);
  });

  it('throws on NaN, +Infinity or an all −Infinity trace', () => {
    expect(() => occupiedBandwidthFromTrace([1, 2], [0, NaN])).toThrow(
      /^occupiedBandwidthFromTrace: levelDbm\[1\]/,
    );
    expect(() => occupiedBandwidthFromTrace([1, 2], [Infinity, 0])).toThrow(RangeError);
    expect(() => occupiedBandwidthFromTrace([1, 2], [-Infinity, -Infinity])).toThrow(
      /holds no power/,
    );
  });
});
