/**
 * Printed as a figure: the plain data of one vector plot (no drawing state), shared by the report
 * and the certificate templates.
 */

/** One data series; `x` and `y` have equal length, x ascending for traces and limits. */
export interface PlotSeries {
  /** Legend text, for example "Measured PSD" or "47 CFR 80.211(f) mask". */
  name: string;
  x: ArrayLike<number>;
  y: ArrayLike<number>;
  /** trace: solid line; limit: dashed line in the limit colour; products: stems (IMD spectrum). */
  role: 'trace' | 'limit' | 'products';
}

export interface PlotSpec {
  title: string;
  /** Axis captions including units, for example "Offset from carrier (Hz)". */
  xLabel: string;
  yLabel: string;
  series: PlotSeries[];
  /** The point to call out, usually the worst margin to the limit. */
  marker?: { x: number; y: number; label: string };
}
