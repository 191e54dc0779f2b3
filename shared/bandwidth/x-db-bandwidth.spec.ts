import { xDbBandwidth } from './x-db-bandwidth';

describe('xDbBandwidth (ITU-R SM.328 §1.8 definition)', () => {
  it('interpolates linearly in dB between the bracketing points (hand arithmetic)', () => {
    expect(xDbBandwidth([0, 1000, 2000, 3000, 4000], [-60, -20, 0, -20, -60], 26)).toEqual({
      lowerHz: 850,
      upperHz: 3150,
      bandwidthHz: 2300,
      peakHz: 2000,
      peakDb: 0,
    });
  });

  it('a point exactly x dB down counts as outside ("attenuated by at least x dB")', () => {
    // level = −((f − 1000)/100)² dB: −25 dB at 500 and 1500 Hz exactly
    const f = Array.from({ length: 21 }, (_, i) => i * 100);
    const l = f.map((hz) => -(((hz - 1000) / 100) ** 2));
    const r = xDbBandwidth(f, l, 25);
    expect(r.lowerHz).toBe(500);
    expect(r.upperHz).toBe(1500);
    expect(r.bandwidthHz).toBe(1000);
  });

  it('uses the OUTERMOST crossings when the spectrum dips in the middle (two-tone spectrum)', () => {
    const f = [0, 100, 200, 300, 400, 500, 600];
    const l = [-80, 0, -70, -70, -70, 0, -80];
    const r = xDbBandwidth(f, l, 60);
    // lower: between 0 (−80) and 100 (0): −60 at 25 Hz; upper symmetric at 575 Hz
    expect(r.lowerHz).toBeCloseTo(25, 12);
    expect(r.upperHz).toBeCloseTo(575, 12);
    expect(r.peakHz).toBe(100); // the first of equal peaks
  });

  it('a −Infinity neighbour puts the limit on the inner point', () => {
    expect(xDbBandwidth([0, 10, 20], [-Infinity, 0, -Infinity], 6).bandwidthHz).toBe(0);
  });

  it('does not depend on the dB reference (shift invariance)', () => {
    const f = [0, 1000, 2000, 3000, 4000];
    const a = xDbBandwidth(f, [-60, -20, 0, -20, -60], 26);
    const b = xDbBandwidth(f, [-13, 27, 47, 27, -13], 26);
    expect(b.bandwidthHz).toBeCloseTo(a.bandwidthHz, 9);
  });

  it('throws when the trace does not fall x dB on both sides, and on bad input', () => {
    expect(() => xDbBandwidth([0, 1, 2], [0, -10, -40], 26)).toThrow(
      /^xDbBandwidth: the trace does not fall 26 dB below the peak on both sides/,
    );
    expect(() => xDbBandwidth([0, 1], [0, 0], 0)).toThrow(/xDb/);
    expect(() => xDbBandwidth([0], [0], 6)).toThrow(/at least two points/);
    expect(() => xDbBandwidth([], [], 6)).toThrow(RangeError);
    expect(() => xDbBandwidth([0, 1], [0], 6)).toThrow(/lengths differ/);
    expect(() => xDbBandwidth([1, 0, 2], [-50, 0, -50], 6)).toThrow(/ascending/);
    expect(() => xDbBandwidth([0, 1, 2], [-50, NaN, -50], 6)).toThrow(/levelDb\[1\]/);
    expect(() => xDbBandwidth([0, 1], [-Infinity, -Infinity], 6)).toThrow(/no power/);
  });
});
