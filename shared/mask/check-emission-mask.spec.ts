import fc from 'fast-check';
import { checkEmissionMask } from './check-emission-mask';
import type { EmissionMask, MaskVertex } from './emission-mask';
import type { MaskTrace } from './mask-check-result';
import { maritimeMask80211 } from './maritime-mask-80-211';

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/**
 * Naive reference written from the mask definition, independent of the segment compiler: for
 * each |offset| scan the vertex list; at an offset carried by vertices take the highest of their
 * values (less stringent at a step); between two vertices interpolate linearly; before the
 * first / after the last hold the end value.
 */
function naiveLimitDb(vertices: readonly MaskVertex[], a: number): number {
  const here = vertices.filter(([x]) => x === a).map(([, db]) => db);
  if (here.length > 0) return Math.max(...here);
  if (a < vertices[0][0]) return vertices[0][1];
  const last = vertices[vertices.length - 1];
  if (a > last[0]) return last[1];
  for (let k = 0; k + 1 < vertices.length; k++) {
    const [x0, y0] = vertices[k];
    const [x1, y1] = vertices[k + 1];
    if (x0 < a && a < x1) return y0 + ((y1 - y0) * (a - x0)) / (x1 - x0);
  }
  throw new Error('unreachable');
}

function naiveCheck(
  f: ArrayLike<number>,
  level: ArrayLike<number>,
  mask: EmissionMask,
  c: number,
  ref: number,
) {
  let worst = Infinity;
  let worstIndex = -1;
  let count = 0;
  const margins: number[] = [];
  for (let i = 0; i < f.length; i++) {
    const a = Math.abs(f[i] - c);
    if (a < (mask.exemptWithinOffsetHz ?? 0)) {
      margins.push(NaN);
      continue;
    }
    const margin = ref + naiveLimitDb(mask.vertices, a) - level[i];
    margins.push(margin);
    count++;
    if (margin < worst) {
      worst = margin;
      worstIndex = i;
    }
  }
  return { worst, worstIndex, count, margins };
}


/** Per-segment check: each segment's count and worst margin against the naive assignment. */
function expectSegmentsMatchNaive(
  r: ReturnType<typeof checkEmissionMask>,
  f: Float64Array,
  mask: EmissionMask,
  c: number,
  margins: number[],
): void {
  const n = f.length;
  r.segments.forEach((s, index) => {
    let min = Infinity;
    let count = 0;
    for (let k = 0; k < n; k++) {
      const a = Math.abs(f[k] - c);
      const m = margins[k];
      if (Number.isNaN(m) || a < s.fromOffsetHz || a > s.toOffsetHz) continue;
      // At a boundary the point belongs to the side whose limit there is the less stringent
      // (the naive limit); when both sides agree it belongs to the inner side.
      const limitHere = naiveLimitDb(mask.vertices, a);
      if (a === s.toOffsetHz && limitHere !== s.toRelDb) continue;
      if (a === s.fromOffsetHz && a > 0) {
        const inner = r.segments[index - 1];
        if (limitHere !== s.fromRelDb || inner.toRelDb === limitHere) continue;
      }
      count++;
      min = Math.min(min, m);
    }
    expect(s.pointCount).toBe(count);
    if (count > 0) expect(s.worstMarginDb).toBeCloseTo(min, 9);
  });
}

describe('checkEmissionMask', () => {
  const simple: EmissionMask = {
    reference: 'pep',
    vertices: [
      [1000, 0],
      [2000, -40],
    ],
  };

  it('computes margin = limit − level and the worst point', () => {
    // limits (common practice reading of the mask): 0 dB inside 1 kHz, −20 dB at 1.5 kHz,
    // −40 dB beyond 2 kHz
    const r = checkEmissionMask(
      { frequencyHz: [-1500, 0, 1500, 3000], levelDbm: [-25, -10, -21, -60] },
      simple,
      { centerHz: 0, referenceDbm: 0 },
    );
    expect(r.verdict).toBe('pass');
    expect(r.worstMarginDb).toBeCloseTo(1, 12);
    expect(r.worstIndex).toBe(2);
    expect(r.worstFrequencyHz).toBe(1500);
    expect(r.pointCount).toBe(4);
    expect(r.reference).toBe('pep');
    expect(r.segments).toHaveLength(3);
    expect(r.segments.map((s) => [s.fromOffsetHz, s.toOffsetHz, s.pointCount])).toEqual([
      [0, 1000, 1],
      [1000, 2000, 2],
      [2000, Infinity, 1],
    ]);
    expect(r.segments[0].worstMarginDb).toBe(10);
    expect(r.segments[1].worstMarginDb).toBeCloseTo(1, 12);
    expect(r.segments[1].worstFrequencyHz).toBe(1500);
    expect(r.segments[2].worstMarginDb).toBe(20);
  });

  it('fails with a negative margin when a point is over the limit; empty segments report NaN', () => {
    const r = checkEmissionMask({ frequencyHz: [2500], levelDbm: [-39] }, simple, {
      centerHz: 0,
      referenceDbm: 0,
    });
    expect(r.verdict).toBe('fail');
    expect(r.worstMarginDb).toBe(-1);
    expect(r.segments[0].pointCount).toBe(0);
    expect(Number.isNaN(r.segments[0].worstMarginDb)).toBe(true);
    expect(Number.isNaN(r.segments[0].worstFrequencyHz)).toBe(true);
  });

  it('a margin of exactly 0 passes; -Infinity dBm (no power) has infinite margin', () => {
    const r = checkEmissionMask({ frequencyHz: [5000, 6000], levelDbm: [-40, -Infinity] }, simple, {
      centerHz: 0,
      referenceDbm: 0,
    });
    expect(r.verdict).toBe('pass');
    expect(r.worstMarginDb).toBe(0);
    const none = checkEmissionMask({ frequencyHz: [5000], levelDbm: [-Infinity] }, simple, {
      centerHz: 0,
      referenceDbm: 0,
    });
    expect(none.worstMarginDb).toBe(Infinity);
    expect(none.worstIndex).toBe(0);
  });

  it('corrects noise-like levels by 10·log10(refBW/RBW): 300 Hz → 4 kHz is +11.25 dB (published)', () => {
    const trace = { frequencyHz: [5000], levelDbm: [-60], rbwHz: 300 };
    const noise = checkEmissionMask(trace, simple, {
      centerHz: 0,
      referenceDbm: 0,
      referenceBandwidthHz: 4000,
      noiseLike: true,
    });
    expect(noise.correctionDb).toBeCloseTo(11.25, 2);
    expect(noise.worstMarginDb).toBeCloseTo(20 - 11.25, 2);
    // a CW tone is not corrected (published: tones do not scale with bandwidth)
    const cw = checkEmissionMask(trace, simple, {
      centerHz: 0,
      referenceDbm: 0,
      referenceBandwidthHz: 4000,
      noiseLike: false,
    });
    expect(cw.correctionDb).toBe(0);
    expect(cw.worstMarginDb).toBe(20);
    // noise-like but no reference bandwidth: nothing to correct to
    expect(
      checkEmissionMask(trace, simple, { centerHz: 0, referenceDbm: 0, noiseLike: true })
        .correctionDb,
    ).toBe(0);
  });

  it('skips the exempt band and counts only compared points', () => {
    const mask = maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 100 });
    const c = 2_183_400;
    const r = checkEmissionMask(
      // in-band points far above the mean-power reference are not compared (no limit within 50 %)
      { frequencyHz: [c - 1000, c, c + 1499, c + 1500, c + 3000], levelDbm: [55, 55, 55, 49, 20] },
      mask,
      { centerHz: c, referenceDbm: 50 },
    );
    expect(r.pointCount).toBe(2);
    expect(r.worstIndex).toBe(3);
    expect(r.worstMarginDb).toBe(1);
    expect(r.verdict).toBe('pass');
  });

  it('accepts Float64Array and number[] alike, and a one-point trace', () => {
    const f = [100, 1200, 1700, 2600];
    const l = [-3, -12, -30, -45];
    const opts = { centerHz: 0, referenceDbm: 0 };
    const a = checkEmissionMask({ frequencyHz: f, levelDbm: l }, simple, opts);
    const typed = { frequencyHz: Float64Array.from(f), levelDbm: Float64Array.from(l) };
    const b = checkEmissionMask(typed, simple, opts);
    expect(b).toEqual(a);
    expect(
      checkEmissionMask({ frequencyHz: [0], levelDbm: [-1] }, simple, opts).worstMarginDb,
    ).toBe(1);
  });

  it('takes the lowest index on a tie', () => {
    const r = checkEmissionMask({ frequencyHz: [-3000, 3000], levelDbm: [-45, -45] }, simple, {
      centerHz: 0,
      referenceDbm: 0,
    });
    expect(r.worstIndex).toBe(0);
  });

  it.each([
    ['an empty trace', { frequencyHz: [], levelDbm: [] }, {}, /the trace is empty/],
    ['mismatched lengths', { frequencyHz: [1, 2], levelDbm: [1] }, {}, /lengths differ/],
    ['a descending trace', { frequencyHz: [2, 1], levelDbm: [0, 0] }, {}, /ascending \(index 1\)/],
    ['a NaN frequency', { frequencyHz: [1, NaN], levelDbm: [0, 0] }, {}, /ascending/],
    [
      'an infinite frequency',
      { frequencyHz: [1, Infinity], levelDbm: [0, 0] },
      {},
      /finite and ascending/,
    ],
    ['a NaN level', { frequencyHz: [1, 2], levelDbm: [0, NaN] }, {}, /levelDbm\[1\]/],
    ['a +Infinity level', { frequencyHz: [1], levelDbm: [Infinity] }, {}, /levelDbm\[0\]/],
    ['a non-finite centre', { frequencyHz: [1], levelDbm: [0] }, { centerHz: NaN }, /centerHz/],
    [
      'a non-finite reference',
      { frequencyHz: [1], levelDbm: [0] },
      { referenceDbm: Infinity },
      /referenceDbm/,
    ],
    [
      'noise-like without RBW',
      { frequencyHz: [1], levelDbm: [0] },
      { noiseLike: true, referenceBandwidthHz: 4000 },
      /needs trace.rbwHz/,
    ],
  ])('throws on %s', (_, trace, extra, message) => {
    const run = () =>
      checkEmissionMask(trace as { frequencyHz: number[]; levelDbm: number[] }, simple, {
        centerHz: 0,
        referenceDbm: 0,
        ...extra,
      });
    expect(run).toThrow(message);
    expect(run).toThrow(/^checkEmissionMask: /);
  });

  it('throws when every point is exempt, and on non-arrays', () => {
    const mask = maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 100 });
    const opts = { centerHz: 0, referenceDbm: 0 };
    expect(() => checkEmissionMask({ frequencyHz: [0], levelDbm: [0] }, mask, opts)).toThrow(
      /no trace point lies outside the exempt band/,
    );
    const broken = { frequencyHz: null, levelDbm: [] } as unknown as MaskTrace;
    expect(() => checkEmissionMask(broken, simple, opts)).toThrow(TypeError);
  });

  it('gives the same margins for a trace and its mirror image about the centre (property, seeded)', () => {
    const mask: EmissionMask = {
      reference: 'pep',
      vertices: [
        [700, -2],
        [1500, -2],
        [1500, -30],
        [4200, -41.5],
        [4200, -50],
      ],
    };
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.integer({ min: -40_000, max: 40_000 }),
            fc.double({ min: -120, max: 10, noNaN: true }),
          ),
          { minLength: 1, maxLength: 60 },
        ),
        (points) => {
          const c = 7_100_000;
          // quarter-hertz offsets keep c ± offset exact: a mirrored point has the same |offset|
          const sorted = [...points].sort((p, q) => p[0] - q[0]);
          const f = sorted.map(([o]) => c + o / 4);
          const l = sorted.map(([, level]) => level);
          const fm = sorted.map(([o]) => c - o / 4).reverse();
          const lm = [...l].reverse();
          const opts = { centerHz: c, referenceDbm: 30 };
          const r = checkEmissionMask({ frequencyHz: f, levelDbm: l }, mask, opts);
          const m = checkEmissionMask({ frequencyHz: fm, levelDbm: lm }, mask, opts);
          expect(m.worstMarginDb).toBe(r.worstMarginDb);
          expect(m.pointCount).toBe(r.pointCount);
          expect(m.segments.map((s) => s.worstMarginDb)).toEqual(
            r.segments.map((s) => s.worstMarginDb),
          );
          expect(m.segments.map((s) => s.pointCount)).toEqual(r.segments.map((s) => s.pointCount));
          // the mirrored worst point, moved back to the original side, is as bad as the worst
          // (ties may pick a different point of equal margin)
          const back = checkEmissionMask(
            { frequencyHz: [2 * c - m.worstFrequencyHz], levelDbm: [lm[m.worstIndex]] },
            mask,
            opts,
          );
          expect(back.worstMarginDb).toBe(r.worstMarginDb);
        },
      ),
      { seed: 80211, numRuns: 300 },
    );
  });

  describe('100,001-point traces against the naive per-point reference', () => {
    it('maritime mask on a 0.25 Hz grid that hits every step exactly', () => {
      const rand = mulberry32(2182);
      const n = 100_001;
      const c = 2_183_400;
      const f = new Float64Array(n);
      const l = new Float64Array(n);
      for (let k = 0; k < n; k++) {
        f[k] = c + (k - 50_000) * 0.25; // ±12.5 kHz, exact in binary
        const a = Math.abs(f[k] - c);
        // a level that hugs the mask so many points sit within ±3 dB of the limit
        const shape = a <= 1500 ? 47 : a <= 4500 ? 50 - 28 : a <= 7500 ? 50 - 35 : 50 - 63;
        l[k] = shape + (rand() * 6 - 3);
      }
      const mask = maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 100 });
      const opts = { centerHz: c, referenceDbm: 50 };
      const r = checkEmissionMask({ frequencyHz: f, levelDbm: l }, mask, opts);
      const naive = naiveCheck(f, l, mask, c, 50);
      expect(r.pointCount).toBe(naive.count);
      expect(r.worstIndex).toBe(naive.worstIndex);
      expect(r.worstMarginDb).toBeCloseTo(naive.worst, 9);
      expect(r.verdict).toBe(naive.worst >= 0 ? 'pass' : 'fail');
      // every segment's worst equals the naive minimum over the points the definition puts in it
      expectSegmentsMatchNaive(r, f, mask, c, naive.margins);
    });

    it('sloped mask on a jittered, sorted trace with repeated frequencies', () => {
      const rand = mulberry32(139);
      const n = 100_001;
      const c = 8_892_400;
      const offsets = Array.from({ length: n }, () => (rand() * 2 - 1) * 30_000);
      for (let k = 0; k < 500; k++) offsets[k * 7] = offsets[k * 7 + 1]; // duplicates
      // points exactly on vertex offsets, both sides, to exercise the step rule
      const exact = [250, 1333.25, 2900.5, 9100, 15_000, 20_000];
      exact.forEach((o, j) => {
        offsets[3 + j * 11] = o;
        offsets[5 + j * 11] = -o;
      });
      offsets.sort((p, q) => p - q);
      const f = Float64Array.from(offsets, (o) => c + o);
      const l = Float64Array.from(f, () => -10 - rand() * 70);
      const mask: EmissionMask = {
        reference: 'pep',
        exemptWithinOffsetHz: 250,
        vertices: [
          [0, 0],
          [1333.25, -6.5],
          [2900.5, -33.25],
          [2900.5, -40],
          [9100, -61],
          [15_000, -61],
          [15_000, -70],
          [20_000, -70],
          [20_000, -55], // a step up: the outer, less stringent value holds at 20 kHz
        ],
      };
      const opts = { centerHz: c, referenceDbm: 37 };
      const r = checkEmissionMask({ frequencyHz: f, levelDbm: l }, mask, opts);
      const naive = naiveCheck(f, l, mask, c, 37);
      expect(r.pointCount).toBe(naive.count);
      expect(r.worstIndex).toBe(naive.worstIndex);
      expect(r.worstMarginDb).toBeCloseTo(naive.worst, 9);
      expect(r.segments.reduce((sum, s) => sum + s.pointCount, 0)).toBe(naive.count);
      expectSegmentsMatchNaive(r, f, mask, c, naive.margins);
      const filled = r.segments.filter((s) => s.pointCount > 0);
      const segmentWorst = Math.min(...filled.map((s) => s.worstMarginDb));
      expect(segmentWorst).toBe(r.worstMarginDb);
    });
  });
});
