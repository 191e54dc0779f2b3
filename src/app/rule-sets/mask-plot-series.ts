/** The x (offset, Hz) and y (limit, dB) arrays a plot of a symmetric emission mask draws. */
export interface MaskSeries {
  offsetHz: number[];
  relDb: number[];
}

/**
 * The mask's limit line over both sides of the assigned frequency, as uPlot's aligned data: x
 * ascending, a step drawn as two points at one x (a vertical segment). The mask is symmetric, so
 * the lower side is the upper side mirrored, its vertices in reverse order so a step still reads
 * from the inner value to the outer one. Inside the first vertex its value holds to 0 Hz, and
 * the last value is drawn on for `extendFraction` of the last offset (at least 500 Hz) beyond it
 * (shared/mask/emission-mask.ts: first value inside the first vertex, last value beyond the last).
 * Input: valid vertices (mask-vertices.ts). An empty list gives empty arrays. Never throws.
 *
 * @example maskPlotSeries([[1500, 0], [1500, -28], [3000, -28]], 0.25)
 * // { offsetHz: [-3750, -3000, -1500, -1500, 0, 1500, 1500, 3000, 3750],
 * //   relDb:    [  -28,   -28,   -28,     0, 0,    0,  -28,  -28,  -28] }
 */
export function maskPlotSeries(vertices: readonly (readonly [number, number])[], extendFraction = 0.25): MaskSeries {
  if (vertices.length === 0) return { offsetHz: [], relDb: [] };
  const last = vertices[vertices.length - 1];
  const beyondHz = last[0] + Math.max(500, last[0] * extendFraction);
  const upper: [number, number][] = vertices[0][0] > 0 ? [[0, vertices[0][1]]] : [];
  upper.push(...vertices.map(([x, y]) => [x, y] as [number, number]), [beyondHz, last[1]]);
  // Mirror everything above 0 Hz; the point at 0 Hz is shared by both sides.
  const lower = upper
    .filter(([x]) => x > 0)
    .reverse()
    .map(([x, y]) => [-x, y] as [number, number]);
  const points = [...lower, ...upper];
  return { offsetHz: points.map(([x]) => x), relDb: points.map(([, y]) => y) };
}
