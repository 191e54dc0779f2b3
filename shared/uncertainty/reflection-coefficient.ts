import { requireNumber } from '../units/number-guards';

/**
 * Magnitude of the reflection coefficient from VSWR: |Γ| = (VSWR − 1)/(VSWR + 1).
 *
 * Source: transmission-line relation (published, e.g. in mismatch-uncertainty guidance).
 * VSWR 1.5 → 0.2; VSWR 2 → 1/3. Domain: VSWR ≥ 1; +Infinity (open or short) gives 1.
 * Bad input: NaN or VSWR < 1 → RangeError; non-number → TypeError.
 *
 * @example reflectionCoefficientFromVswr(1.5); // 0.2
 */
export function reflectionCoefficientFromVswr(vswr: number): number {
  const s = requireNumber('reflectionCoefficientFromVswr', 'vswr', vswr);
  if (!(s >= 1)) throw new RangeError(`reflectionCoefficientFromVswr: vswr must be ≥ 1, got ${s}`);
  if (s === Infinity) return 1;
  return (s - 1) / (s + 1);
}

/**
 * VSWR from the magnitude of the reflection coefficient: (1 + |Γ|)/(1 − |Γ|); |Γ| = 1 gives
 * +Infinity. Domain: 0 ≤ |Γ| ≤ 1. Bad input: RangeError starting with the function name.
 *
 * @example vswrFromReflectionCoefficient(0.2); // 1.5
 */
export function vswrFromReflectionCoefficient(gamma: number): number {
  const g = requireNumber('vswrFromReflectionCoefficient', 'gamma', gamma);
  if (!(g >= 0 && g <= 1)) {
    throw new RangeError(`vswrFromReflectionCoefficient: gamma must be within 0…1, got ${g}`);
  }
  return (1 + g) / (1 - g);
}
