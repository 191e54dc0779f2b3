/** Which measured power a mask's relative levels are referred to. */
export type MaskReference = 'pep' | 'mean';

/** One corner of a mask: offset from the centre frequency (Hz, ≥ 0) and limit (dB, ≤ 0). */
export type MaskVertex = readonly [offsetHz: number, relDb: number];

/** Where a mask's numbers come from, stored with every check so a report can cite them. */
export interface MaskProvenance {
  title: string;
  /** Rule and paragraph, e.g. '47 CFR 80.211(a)'. */
  source: string;
  /** Edition of the text the numbers were taken from, or what is known about it. */
  edition: string;
  /** 'published' when checked against the text, 'from-memory' when recalled and to be verified. */
  status: 'published' | 'from-memory';
  notes: readonly string[];
}

/**
 * An emission mask symmetric about a centre frequency. The limit at |offset| is, relative to
 * the reference level (relDb ≤ 0):
 * - linear in dB over Hz between consecutive vertices;
 * - at a step (two vertices at one offset) the LESS stringent (higher) value holds exactly at
 *   the step offset, so "more than X up to and including Y" rules are written as steps at X
 *   and Y;
 * - the first vertex's value holds inside the first vertex, the last value beyond the last.
 * Vertices are listed by non-decreasing offset; at most two share an offset, and no step at 0.
 */
export interface EmissionMask {
  reference: MaskReference;
  vertices: readonly MaskVertex[];
  /**
   * Trace points with |offset| strictly below this are not compared (the band where the rule
   * sets no limit, e.g. within 50 % of the authorized bandwidth). Default 0: all compared.
   */
  exemptWithinOffsetHz?: number;
  provenance?: MaskProvenance;
}
