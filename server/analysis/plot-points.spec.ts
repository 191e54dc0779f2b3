import { MAX_PLOT_POINTS, thinForPlot } from './plot-points';

describe('thinForPlot', () => {
  it('keeps at most 4000 points of a long trace and every bucket’s extremes (peaks survive)', () => {
    const n = 100_001;
    const x = Array.from({ length: n }, (_, k) => k);
    const y = x.map((k) => -90 + ((k * 7919) % 13) * 0.1);
    y[54_321] = 12.5; // a narrow line between buckets' starts
    y[77_777] = -140;
    const plot = thinForPlot(x, y);
    expect(plot.x.length).toBeLessThanOrEqual(MAX_PLOT_POINTS);
    expect(Math.max(...(plot.y as number[]))).toBe(12.5);
    expect(Math.min(...(plot.y as number[]))).toBe(-140);
    expect(plot.x).toContain(54_321);
  });

  it('returns a short series unchanged, with a bin of no power as a null gap (JSON has no -Infinity)', () => {
    expect(thinForPlot([1, 2, 3], [-10.12345, -Infinity, 0])).toEqual({ x: [1, 2, 3], y: [-10.123, null, 0] });
    expect(JSON.parse(JSON.stringify(thinForPlot([1], [NaN])))).toEqual({ x: [1], y: [null] });
  });
});
