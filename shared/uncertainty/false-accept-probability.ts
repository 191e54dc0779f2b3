import { requireFinite, requirePositive } from '../units/number-guards';
import type { LimitDirection } from './decision-rule';
import { normalCdf } from './normal-cdf';

/**
 * Specific risk of a false accept: the probability that the true value lies outside the
 * tolerance limit, given a measured value, when the measurand's distribution about the measured
 * value is normal with standard uncertainty u = U/k.
 *   at-least: P(true < TL) = Φ((TL − v)/u);  at-most: P(true > TL) = Φ((v − TL)/u)
 * At v = TL (either direction) the risk is 50 %; at the acceptance limit v = TL + U with k = 2
 * it is Φ(−2) = 2.28 % (ILAC-G8:09/2019 guard band w = U).
 *
 * Source: ILAC-G8:09/2019 §4 and JCGM 106:2012 (specific risk); Φ from Abramowitz & Stegun
 * 7.1.26, absolute error ≤ 7.5 × 10⁻⁸ (see normalCdf).
 * Domain: value and limit finite; expandedUncertainty > 0; coverageFactor > 0 (default 2).
 * Bad input: RangeError starting with the function name.
 *
 * @example
 * falseAcceptProbability({ value: 41.21, limit: 40, direction: 'at-least',
 *   expandedUncertainty: 1.21 });
 * // ≈ 0.02275
 */
export function falseAcceptProbability(input: {
  value: number;
  limit: number;
  direction: LimitDirection;
  expandedUncertainty: number;
  coverageFactor?: number;
}): number {
  const fn = 'falseAcceptProbability';
  const value = requireFinite(fn, 'value', input.value);
  const limit = requireFinite(fn, 'limit', input.limit);
  const u =
    requirePositive(fn, 'expandedUncertainty', input.expandedUncertainty) /
    requirePositive(fn, 'coverageFactor', input.coverageFactor ?? 2);
  if (input.direction === 'at-least') return normalCdf((limit - value) / u);
  if (input.direction === 'at-most') return normalCdf((value - limit) / u);
  throw new RangeError(`${fn}: direction must be 'at-least' or 'at-most'`);
}
