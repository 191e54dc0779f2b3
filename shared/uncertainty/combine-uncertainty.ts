import { requireNonNegative, requirePositive } from '../units/number-guards';
import { distributionDivisor, sensitivityOf } from './uncertainty-contribution';
import type { UncertaintyContribution } from './uncertainty-contribution';

/** One evaluated budget row. */
export interface UncertaintyRow {
  name: string;
  /** Standard uncertainty u_i of the input quantity. */
  standard: number;
  /** |c_i|·u_i: the row's contribution to the combined standard uncertainty. */
  contribution: number;
  /** Share of the combined variance, (c_i·u_i)² / u_c², 0…1 (0 when u_c is 0). */
  varianceShare: number;
}

export interface UncertaintyResult {
  combinedStandard: number;
  expanded: number;
  coverageFactor: number;
  rows: UncertaintyRow[];
}

/**
 * Combines uncorrelated contributions by the law of propagation of uncertainty:
 * u_c = √Σ (c_i·u_i)², U = k·u_c (k = 2 by default, about 95 % coverage for a normal result).
 *
 * Source: GUM JCGM 100:2008 §5.1.2 (uncorrelated inputs) and §6.2. Worked check (common
 * practice): analyzer ±1.0 dB rectangular (0.577), mismatch 0.122 standard, calibration
 * U = 0.2 dB k = 2 (0.100), repeatability 0.100 → u_c = 0.607 dB, U = 1.21 dB.
 * Correlated inputs are not handled: combine them first into one row.
 * Units: those of the values (dB for level budgets). Domain: at least one contribution;
 * values ≥ 0; coverage factors > 0; sensitivities finite.
 * Bad input: RangeError (TypeError for a non-array) starting with the function name.
 *
 * @example combineUncertainty([{ name: 'cal', distribution: 'normal', value: 0.2 }]);
 * // { combinedStandard: 0.1, expanded: 0.2, coverageFactor: 2, rows: [...] }
 */
export function combineUncertainty(
  contributions: UncertaintyContribution[],
  options?: { coverageFactor?: number },
): UncertaintyResult {
  const fn = 'combineUncertainty';
  if (!Array.isArray(contributions)) throw new TypeError(`${fn}: contributions must be an array`);
  if (contributions.length === 0) throw new RangeError(`${fn}: the budget has no contributions`);
  const k = requirePositive(fn, 'coverageFactor', options?.coverageFactor ?? 2);
  const evaluated = contributions.map((c, index) => {
    if (typeof c?.name !== 'string') {
      throw new TypeError(`${fn}: contributions[${index}].name must be a string`);
    }
    const value = requireNonNegative(fn, `${c.name}.value`, c.value);
    const standard = value / distributionDivisor(fn, c);
    return { name: c.name, standard, contribution: Math.abs(sensitivityOf(fn, c)) * standard };
  });
  // Scale by the largest term so squares neither overflow nor underflow.
  const largest = Math.max(...evaluated.map((r) => r.contribution));
  let sumSquares = 0;
  for (const r of evaluated) sumSquares += largest > 0 ? (r.contribution / largest) ** 2 : 0;
  const combinedStandard = largest * Math.sqrt(sumSquares);
  const rows = evaluated.map((r) => ({
    ...r,
    varianceShare: combinedStandard > 0 ? (r.contribution / combinedStandard) ** 2 : 0,
  }));
  return { combinedStandard, expanded: k * combinedStandard, coverageFactor: k, rows };
}
