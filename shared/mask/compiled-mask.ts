import type { EmissionMask } from './emission-mask';

/**
 * A mask turned into consecutive segments over |offset| for walking with a moving pointer.
 * Segment s spans [startHz[s], endHz[s]] (the last ends at +Infinity); its limit runs linearly
 * from startDb to endDb. A point exactly at endHz[s] belongs to segment s when ownsEnd[s] is 1,
 * otherwise to s + 1 — whichever side carries the less stringent value at a step.
 */
export interface CompiledMask {
  count: number;
  startHz: Float64Array;
  endHz: Float64Array;
  widthHz: Float64Array;
  startDb: Float64Array;
  endDb: Float64Array;
  ownsEnd: Uint8Array;
  exemptWithinOffsetHz: number;
}

/**
 * Validates a mask and compiles it. Throws a RangeError (TypeError for a malformed object)
 * whose message starts with `fnName`.
 */
export function compileEmissionMask(fnName: string, mask: EmissionMask): CompiledMask {
  if (mask === null || typeof mask !== 'object' || !Array.isArray(mask.vertices)) {
    throw new TypeError(`${fnName}: mask must be an object with a vertices array`);
  }
  if (mask.reference !== 'pep' && mask.reference !== 'mean') {
    throw new RangeError(`${fnName}: mask.reference must be 'pep' or 'mean'`);
  }
  const v = mask.vertices;
  if (v.length === 0) throw new RangeError(`${fnName}: mask has no vertices`);
  // Distinct offsets with the value arriving at (inner) and leaving (outer) each one.
  const offsets: number[] = [];
  const inner: number[] = [];
  const outer: number[] = [];
  const atOffset: number[] = [];
  v.forEach((vertex, index) => {
    const [offsetHz, relDb] = vertex;
    if (!Number.isFinite(offsetHz) || offsetHz < 0) {
      throw new RangeError(`${fnName}: vertex ${index} offset must be finite and ≥ 0`);
    }
    if (!Number.isFinite(relDb) || relDb > 0) {
      throw new RangeError(`${fnName}: vertex ${index} relDb must be finite and ≤ 0`);
    }
    const last = offsets.length - 1;
    if (last >= 0 && offsetHz < offsets[last]) {
      throw new RangeError(`${fnName}: vertex ${index} offset is below the previous one`);
    }
    if (last >= 0 && offsetHz === offsets[last]) {
      if (atOffset[last] === 2) {
        throw new RangeError(`${fnName}: more than two vertices at offset ${offsetHz} Hz`);
      }
      if (offsetHz === 0) throw new RangeError(`${fnName}: a step at offset 0 is meaningless`);
      outer[last] = relDb;
      atOffset[last] = 2;
      return;
    }
    offsets.push(offsetHz);
    inner.push(relDb);
    outer.push(relDb);
    atOffset.push(1);
  });
  const exempt = mask.exemptWithinOffsetHz ?? 0;
  if (!Number.isFinite(exempt) || exempt < 0) {
    throw new RangeError(`${fnName}: mask.exemptWithinOffsetHz must be finite and ≥ 0`);
  }

  const segments: Array<[number, number, number, number, boolean]> = [];
  const m = offsets.length - 1;
  if (offsets[0] > 0) segments.push([0, offsets[0], inner[0], inner[0], inner[0] >= outer[0]]);
  for (let j = 0; j < m; j++) {
    const ownsEnd = inner[j + 1] >= outer[j + 1];
    segments.push([offsets[j], offsets[j + 1], outer[j], inner[j + 1], ownsEnd]);
  }
  segments.push([offsets[m], Infinity, outer[m], outer[m], true]);

  const count = segments.length;
  const compiled: CompiledMask = {
    count,
    startHz: new Float64Array(count),
    endHz: new Float64Array(count),
    widthHz: new Float64Array(count),
    startDb: new Float64Array(count),
    endDb: new Float64Array(count),
    ownsEnd: new Uint8Array(count),
    exemptWithinOffsetHz: exempt,
  };
  segments.forEach(([start, end, fromDb, toDb, owns], s) => {
    compiled.startHz[s] = start;
    compiled.endHz[s] = end;
    compiled.widthHz[s] = end - start;
    compiled.startDb[s] = fromDb;
    compiled.endDb[s] = toDb;
    compiled.ownsEnd[s] = owns ? 1 : 0;
  });
  return compiled;
}

/**
 * Limit (dB re reference) of segment s at |offset| `offsetHz` inside it. The weights form
 * (1 − t)·a + t·b returns a and b exactly at the ends, so steps hold their values exactly.
 */
export function segmentLimitDb(mask: CompiledMask, s: number, offsetHz: number): number {
  const from = mask.startDb[s];
  const to = mask.endDb[s];
  if (from === to) return from;
  const t = (offsetHz - mask.startHz[s]) / mask.widthHz[s];
  return from * (1 - t) + to * t;
}
