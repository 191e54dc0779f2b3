/** The mask as the server stores it beside an emission-mask result (shared/evaluation MaskFigures). */
export interface MaskLine {
  assignedHz: number;
  referenceDbm: number;
  exemptWithinOffsetHz: number;
  /** Consecutive regions over |offset|; toOffsetHz null for the last, open-ended one. */
  segments: readonly { fromOffsetHz: number; toOffsetHz: number | null; fromRelDb: number; toRelDb: number }[];
}

/**
 * The mask as an absolute limit at each trace frequency, for drawing over the trace:
 * limit = referenceDbm + relDb(|f − assignedHz|), relDb linear in dB over Hz within a segment.
 * Where two segments meet, the less stringent (higher) value holds exactly at the boundary, as
 * "more than X up to and including Y" reads (47 CFR 80.211(a)); points with |offset| below
 * exemptWithinOffsetHz get null (no limit there). Units: Hz in, dBm out. Pure; a mask without
 * segments gives nulls everywhere.
 * @example maskLimitLine([2184000], { assignedHz: 2182000, referenceDbm: 40, exemptWithinOffsetHz: 1500,
 *   segments: [{ fromOffsetHz: 1500, toOffsetHz: 4500, fromRelDb: -28, toRelDb: -28 }] }) // [12]
 */
export function maskLimitLine(frequencyHz: ArrayLike<number>, mask: MaskLine): (number | null)[] {
  const out = new Array<number | null>(frequencyHz.length);
  const segs = mask.segments;
  for (let i = 0; i < frequencyHz.length; i++) {
    const a = Math.abs(frequencyHz[i] - mask.assignedHz);
    if (a < mask.exemptWithinOffsetHz || segs.length === 0) {
      out[i] = null;
      continue;
    }
    let best: number | null = null;
    for (const s of segs) {
      const to = s.toOffsetHz ?? Infinity;
      if (a < s.fromOffsetHz || a > to) continue;
      const rel = to === Infinity || to === s.fromOffsetHz ? s.fromRelDb : s.fromRelDb + ((s.toRelDb - s.fromRelDb) * (a - s.fromOffsetHz)) / (to - s.fromOffsetHz);
      best = best === null ? rel : Math.max(best, rel);
    }
    out[i] = best === null ? null : mask.referenceDbm + best;
  }
  return out;
}
