import { requireFinite, requireNonNegative } from '../units/number-guards';

/**
 * Checks a frequency error against a tolerance: margin = tolerance − |error| (Hz); passes when
 * |error| ≤ tolerance ("shall be maintained within", so equality passes).
 *
 * Source: tolerances such as 47 CFR 80.209 (maritime SSB 20 Hz, 1.6–27.5 MHz) and 87.133
 * (aeronautical fixed SSB 50 Hz at ≤ 500 W, 20 Hz above) as published. Apply a decision rule
 * with the measurement uncertainty separately (see uncertainty/decision-rule).
 * Units: Hz. Domain: errorHz finite (either sign), toleranceHz ≥ 0.
 * Bad input: RangeError starting with the function name.
 *
 * @example checkFrequencyTolerance({ errorHz: -12, toleranceHz: 20 });
 * // { pass: true, marginHz: 8, absoluteErrorHz: 12 }
 */
export function checkFrequencyTolerance(check: { errorHz: number; toleranceHz: number }): {
  pass: boolean;
  marginHz: number;
  absoluteErrorHz: number;
} {
  const error = requireFinite('checkFrequencyTolerance', 'errorHz', check.errorHz);
  const tolerance = requireNonNegative('checkFrequencyTolerance', 'toleranceHz', check.toleranceHz);
  const absoluteErrorHz = Math.abs(error);
  const marginHz = tolerance - absoluteErrorHz;
  return { pass: marginHz >= 0, marginHz, absoluteErrorHz };
}
