import type { RuleSetBody } from '../../shared/rules/rule-set';
import type { PlotSeries } from './plot-points';

/**
 * The emission mask as absolute levels for the chart: one polyline per side of the assigned
 * frequency, from the first vertex outwards to `spanHz` (the last limit holds beyond the last
 * vertex), level = referenceDbm + relDb. Steps are drawn as two points at one frequency.
 *
 * @example maskLimitLine({ reference: 'pep', vertices: [[1500, 0], [1500, -30]], source: '' }, 1e6, 40, 3000).upper
 * // { x: [1001500, 1001500, 1003000], y: [40, 10, 10] }
 */
export function maskLimitLine(mask: NonNullable<RuleSetBody['limits']['emissionMask']>, assignedHz: number, referenceDbm: number, spanHz: number): { upper: PlotSeries; lower: PlotSeries } {
  const side = (sign: 1 | -1): PlotSeries => {
    const x = mask.vertices.map(([offsetHz]) => assignedHz + sign * offsetHz);
    const y = mask.vertices.map(([, relDb]) => referenceDbm + relDb);
    const last = mask.vertices[mask.vertices.length - 1];
    if (last && spanHz > last[0]) {
      x.push(assignedHz + sign * spanHz);
      y.push(referenceDbm + last[1]);
    }
    return { x, y };
  };
  return { upper: side(1), lower: side(-1) };
}
