import { reflectionCoefficientFromVswr } from './reflection-coefficient';

/** Mismatch error limits between a source and a load. */
export interface MismatchLimits {
  /** 20·log10(1 − |Γs||Γl|), dB (≤ 0). */
  lowerDb: number;
  /** 20·log10(1 + |Γs||Γl|), dB (≥ 0). */
  upperDb: number;
  /** The larger magnitude of the two limits, dB: the half-width to enter as U-shaped. */
  halfWidthDb: number;
  gammaSource: number;
  gammaLoad: number;
}

/**
 * Limits of the mismatch error between a source and a load of given VSWRs:
 * Γ = (VSWR − 1)/(VSWR + 1), limits 20·log10(1 ± |Γs||Γl|) dB. The phase of the product is
 * unknown, so the error is U-shaped between the limits; enter halfWidthDb (the larger, lower
 * limit's magnitude, a conservative choice) with distribution 'u-shaped'.
 *
 * Source: mismatch uncertainty limits 20·log10(1 ± |Γs||Γl|) (published relation, as in
 * EA-4/02 and instrument application notes). Units: dB. Domain: VSWRs ≥ 1 (+Infinity allowed).
 * Bad input: RangeError starting with the function name.
 *
 * @example mismatchLimitsDb(1.5, 2); // { lowerDb: -0.599, upperDb: 0.561, halfWidthDb: 0.599, … }
 */
export function mismatchLimitsDb(vswrSource: number, vswrLoad: number): MismatchLimits {
  let gammaSource: number;
  let gammaLoad: number;
  try {
    gammaSource = reflectionCoefficientFromVswr(vswrSource);
    gammaLoad = reflectionCoefficientFromVswr(vswrLoad);
  } catch (error) {
    // Re-badge so the message names the function that was called.
    throw new RangeError(`mismatchLimitsDb: ${(error as Error).message.replace(/^[^:]+: /, '')}`);
  }
  const product = gammaSource * gammaLoad;
  const lowerDb = 20 * Math.log10(1 - product);
  const upperDb = 20 * Math.log10(1 + product);
  return { lowerDb, upperDb, halfWidthDb: Math.max(-lowerDb, upperDb), gammaSource, gammaLoad };
}
