import { maskPlotSeries } from './mask-plot-series';
import { maskLimitAtOffset } from '../../../shared/mask/mask-limit-at-offset';
import type { MaskVertex } from '../../../shared/mask/emission-mask';

// 47 CFR 80.211(a), authorized bandwidth 3.0 kHz (offsets from memory), 100 W mean: 28 / 35 / 63 dB.
const MARITIME: MaskVertex[] = [[1500, 0], [1500, -28], [4500, -28], [4500, -35], [7500, -35], [7500, -63]];

/** Linear interpolation along the drawn polyline, the way the plot joins its points (test's own). */
function drawnAt(series: { offsetHz: number[]; relDb: number[] }, x: number): number {
  const { offsetHz: xs, relDb: ys } = series;
  for (let i = 1; i < xs.length; i++) {
    if (x >= xs[i - 1] && x <= xs[i] && xs[i] > xs[i - 1]) return ys[i - 1] + ((ys[i] - ys[i - 1]) * (x - xs[i - 1])) / (xs[i] - xs[i - 1]);
  }
  throw new Error(`x ${x} outside the series`);
}

describe('maskPlotSeries', () => {
  it('draws the regions of 47 CFR 80.211(a) on both sides', () => {
    const s = maskPlotSeries(MARITIME);
    // More than 50 % up to 150 % of 3 kHz: 28 dB; over 150 % to 250 %: 35 dB; beyond: 43 + 10 log10(100) = 63 dB.
    expect(drawnAt(s, 3000)).toBe(-28);
    expect(drawnAt(s, -3000)).toBe(-28);
    expect(drawnAt(s, 6000)).toBe(-35);
    expect(drawnAt(s, -6000)).toBe(-35);
    expect(drawnAt(s, 8000)).toBe(-63);
    expect(drawnAt(s, -8000)).toBe(-63);
  });

  it('keeps x ascending and follows the engine between vertices (two independent paths)', () => {
    const masks: MaskVertex[][] = [MARITIME, [[0, 0], [2000, -30], [5000, -60]], [[1000, -3], [1000, -25], [2500, -40]]];
    for (const vertices of masks) {
      const s = maskPlotSeries(vertices);
      for (let i = 1; i < s.offsetHz.length; i++) expect(s.offsetHz[i]).toBeGreaterThanOrEqual(s.offsetHz[i - 1]);
      const span = s.offsetHz[s.offsetHz.length - 1];
      for (let x = -span; x <= span; x += span / 97) {
        const atStep = vertices.some(([o], j) => j > 0 && vertices[j - 1][0] === o && Math.abs(Math.abs(x) - o) < 1e-9);
        if (!atStep) expect(drawnAt(s, x)).toBeCloseTo(maskLimitAtOffset({ reference: 'pep', vertices }, x), 9);
      }
    }
  });

  it('holds the first value to 0 Hz, extends the last by a quarter and gives nothing for no vertices', () => {
    const s = maskPlotSeries([[1500, -10], [4000, -40]]);
    expect(s.offsetHz).toEqual([-5000, -4000, -1500, 0, 1500, 4000, 5000]);
    expect(s.relDb).toEqual([-40, -40, -10, -10, -10, -40, -40]);
    expect(maskPlotSeries([[0, 0], [100, -20]]).offsetHz).toEqual([-600, -100, 0, 100, 600]);
    expect(maskPlotSeries([])).toEqual({ offsetHz: [], relDb: [] });
  });
});
