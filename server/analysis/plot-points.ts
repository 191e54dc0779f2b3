import { decimateMinMax } from '../../templates/pdf-kit/min-max-decimation';

/** Most points a stored chart series has (the API and the report draw from it, never check it). */
export const MAX_PLOT_POINTS = 4000;

export interface PlotSeries {
  x: (number | null)[];
  y: (number | null)[];
}

/**
 * A trace or PSD thinned for drawing: min/max per bucket (each of 1333 buckets keeps its first,
 * lowest and highest point, so peaks survive) — at most 3999 points — with values rounded to
 * 0.001 and non-finite levels (a bin of no power) as null gaps, so the series is plain JSON.
 * Limit checks always run on the full data, never on this.
 *
 * @example thinForPlot([1, 2], [-10, -Infinity]) // { x: [1, 2], y: [-10, null] }
 */
export function thinForPlot(x: ArrayLike<number>, y: ArrayLike<number>): PlotSeries {
  const thinned = decimateMinMax(x, y, Math.floor(MAX_PLOT_POINTS / 3));
  // Rounded by arithmetic rather than through toFixed's string (a fifth of an upload's CPU time):
  // the result can differ from toFixed only in the last digit of a value exactly halfway.
  const clean = (v: number) => (Number.isFinite(v) ? Math.round(v * 1000) / 1000 : null);
  return { x: thinned.x.map(clean), y: thinned.y.map(clean) };
}

/** JSON has no Infinity or NaN: such a figure is stored as null. */
export const finiteOrNull = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);
