import type { CompiledMask } from './compiled-mask';

/** Per-call scratch: running worst values, overall and per segment. */
export interface MaskWalk {
  mask: CompiledMask;
  f: ArrayLike<number>;
  level: ArrayLike<number>;
  baseDbm: number;
  worstMargin: number;
  worstIndex: number;
  count: number;
  segWorst: Float64Array;
  segIndex: Int32Array;
  segCount: Int32Array;
}

/**
 * Walks the trace from index `from` in steps of `step` (±1) while |offset| grows, moving one
 * pointer along the mask segments: O(points + segments), no search and no allocation per point.
 * Arrays and running worst values are held in locals; a segment's worst is written back only
 * when the pointer leaves it.
 */
export function walkMaskSide(
  fnName: string,
  w: MaskWalk,
  from: number,
  to: number,
  step: 1 | -1,
  centerHz: number,
): void {
  const { mask, f, level, baseDbm, segWorst, segIndex, segCount } = w;
  const { endHz, ownsEnd, startHz, widthHz, startDb, endDb } = mask;
  const exempt = mask.exemptWithinOffsetHz;
  let worstMargin = w.worstMargin;
  let worstIndex = w.worstIndex;
  let count = 0;
  let s = 0;
  let end = endHz[0];
  let owns = ownsEnd[0] === 1;
  let segMin = segWorst[0];
  let segMinIndex = segIndex[0];
  let segN = 0;
  for (let i = from; i !== to; i += step) {
    const a = step * (f[i] - centerHz);
    if (a < exempt) continue;
    if (a > end || (a === end && !owns)) {
      segWorst[s] = segMin;
      segIndex[s] = segMinIndex;
      segCount[s] += segN;
      do s++;
      while (a > endHz[s] || (a === endHz[s] && ownsEnd[s] === 0));
      end = endHz[s];
      owns = ownsEnd[s] === 1;
      segMin = segWorst[s];
      segMinIndex = segIndex[s];
      segN = 0;
    }
    const l = level[i];
    if (!(l < Infinity)) {
      throw new RangeError(`${fnName}: levelDbm[${i}] must be a number below +Infinity`);
    }
    const fromDb = startDb[s];
    const toDb = endDb[s];
    let limitDb = fromDb;
    if (fromDb !== toDb) {
      // (1 − t)·a + t·b returns a and b exactly at the ends, so steps hold their values exactly
      const t = (a - startHz[s]) / widthHz[s];
      limitDb = fromDb * (1 - t) + toDb * t;
    }
    const margin = baseDbm + limitDb - l;
    count++;
    segN++;
    if (margin < worstMargin || (margin === worstMargin && i < worstIndex)) {
      worstMargin = margin;
      worstIndex = i;
    }
    if (!(margin >= segMin) || (margin === segMin && i < segMinIndex)) {
      segMin = margin;
      segMinIndex = i;
    }
  }
  segWorst[s] = segMin;
  segIndex[s] = segMinIndex;
  segCount[s] += segN;
  w.worstMargin = worstMargin;
  w.worstIndex = worstIndex;
  w.count += count;
}
