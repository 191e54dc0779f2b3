import { requireNumber } from '../units/number-guards';
import { compileEmissionMask, segmentLimitDb } from './compiled-mask';
import type { EmissionMask } from './emission-mask';

/**
 * The mask's limit at an offset from its centre, dB relative to the mask's reference level
 * (≤ 0). The mask is symmetric, so the sign of the offset does not matter. Interpolation is
 * linear in dB over Hz; at a step the less stringent value holds exactly at the step; the first
 * value holds inside the first vertex and the last beyond the last vertex (see EmissionMask).
 * Exempt offsets (mask.exemptWithinOffsetHz) still return the mask's value there.
 *
 * Source: limit semantics of the "more than X % up to and including Y %" wording of
 * 47 CFR 80.211 and 87.139. Units: Hz → dB. Domain: finite offset; a valid mask.
 * Bad input: RangeError (TypeError for a malformed mask) starting with the function name.
 *
 * @example
 * const mask = { reference: 'mean', vertices: [[1500, 0], [1500, -28], [4500, -28], [4500, -35]] };
 * maskLimitAtOffset(mask, 4500);  // -28 (exactly at the step: the less stringent value)
 * maskLimitAtOffset(mask, -4501); // -35
 */
export function maskLimitAtOffset(mask: EmissionMask, offsetHz: number): number {
  const fn = 'maskLimitAtOffset';
  const offset = requireNumber(fn, 'offsetHz', offsetHz);
  if (!Number.isFinite(offset)) {
    throw new RangeError(`${fn}: offsetHz must be finite, got ${offset}`);
  }
  const compiled = compileEmissionMask(fn, mask);
  const a = Math.abs(offset);
  let s = 0;
  while (a > compiled.endHz[s] || (a === compiled.endHz[s] && compiled.ownsEnd[s] === 0)) s++;
  return segmentLimitDb(compiled, s, a);
}
