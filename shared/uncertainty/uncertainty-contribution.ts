import { requireFinite, requireNonNegative, requirePositive } from '../units/number-guards';

/** Probability distribution assigned to an input quantity (GUM JCGM 100:2008 §4.3). */
export type UncertaintyDistribution = 'normal' | 'rectangular' | 'u-shaped' | 'triangular';

/**
 * One row of an uncertainty budget. `value` is the half-width a of a rectangular, U-shaped or
 * triangular distribution, or for 'normal' an expanded uncertainty U stated with its coverage
 * factor (default k = 2, as on a calibration certificate; use k = 1 for a standard deviation).
 */
export interface UncertaintyContribution {
  name: string;
  distribution: UncertaintyDistribution;
  value: number;
  coverageFactor?: number;
  /** Sensitivity coefficient c_i, default 1. */
  sensitivity?: number;
}

/** Divisor that turns the stated value into a standard uncertainty. */
export function distributionDivisor(
  fnName: string,
  contribution: Pick<UncertaintyContribution, 'distribution' | 'coverageFactor'>,
): number {
  switch (contribution.distribution) {
    case 'rectangular':
      return Math.sqrt(3);
    case 'u-shaped':
      return Math.SQRT2;
    case 'triangular':
      return Math.sqrt(6);
    case 'normal':
      return requirePositive(fnName, 'coverageFactor', contribution.coverageFactor ?? 2);
    default:
      throw new RangeError(
        `${fnName}: unknown distribution '${String(contribution.distribution)}'`,
      );
  }
}

/**
 * Standard uncertainty of one contribution: u = a/√3 (rectangular), a/√2 (U-shaped),
 * a/√6 (triangular), U/k (normal).
 *
 * Source: GUM JCGM 100:2008 §4.3.7 (rectangular), §4.3.9 (triangular); U-shaped a/√2 for
 * mismatch as in common practice (e.g. EA-4/02). Units: those of `value`.
 * Domain: value ≥ 0 and finite; coverageFactor > 0. Bad input: RangeError naming the function.
 *
 * @example standardUncertainty({ name: 'SA', distribution: 'rectangular', value: 1 });
 * // 0.5773502691896258
 */
export function standardUncertainty(contribution: UncertaintyContribution): number {
  const fn = 'standardUncertainty';
  const value = requireNonNegative(fn, 'value', contribution.value);
  return value / distributionDivisor(fn, contribution);
}

/** Sensitivity coefficient with its default of 1, validated. */
export function sensitivityOf(fnName: string, contribution: UncertaintyContribution): number {
  return requireFinite(fnName, 'sensitivity', contribution.sensitivity ?? 1);
}
