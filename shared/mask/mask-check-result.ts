import type { MaskReference } from './emission-mask';

/** A measured spectrum trace: ascending frequencies and the level in each bin. */
export interface MaskTrace {
  frequencyHz: Float64Array | readonly number[];
  levelDbm: Float64Array | readonly number[];
  /** Resolution bandwidth the trace was taken with, Hz (needed for noise-like correction). */
  rbwHz?: number;
}

export interface MaskCheckOptions {
  /** Frequency the mask is centred on (e.g. the assigned frequency), Hz. */
  centerHz: number;
  /** Measured reference power the mask is relative to (PEP or mean, per mask.reference), dBm. */
  referenceDbm: number;
  /** Bandwidth the rule refers levels to, Hz; used only when noiseLike is true. */
  referenceBandwidthHz?: number;
  /** True for noise-like emissions: levels are scaled by 10·log10(referenceBandwidth/rbw). */
  noiseLike?: boolean;
}

/** The outcome over one mask segment (a region between consecutive vertex offsets). */
export interface MaskSegmentResult {
  fromOffsetHz: number;
  /** +Infinity for the region beyond the last vertex. */
  toOffsetHz: number;
  /** Limit at the segment's ends, dB re reference. */
  fromRelDb: number;
  toRelDb: number;
  pointCount: number;
  /** NaN when no compared trace point fell in the segment. */
  worstMarginDb: number;
  worstFrequencyHz: number;
}

export interface MaskCheckResult {
  verdict: 'pass' | 'fail';
  /** min over compared points of limit − level, dB; negative means over the limit. */
  worstMarginDb: number;
  worstFrequencyHz: number;
  /** Index into the trace of the worst point (the lowest index on a tie). */
  worstIndex: number;
  /** Points compared against the mask (exempt points excluded). */
  pointCount: number;
  segments: MaskSegmentResult[];
  reference: MaskReference;
  /** Correction added to every level, dB (0 unless noise-like with a reference bandwidth). */
  correctionDb: number;
}
