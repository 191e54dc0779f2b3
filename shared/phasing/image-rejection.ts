import { requireFinite, requireNonNegative } from '../units/number-guards';

/** Errors of a phasing SSB modulator: Q-path gain relative to I (dB) and quadrature error (°). */
export interface PhasingErrors {
  amplitudeImbalanceDb: number;
  phaseErrorDeg: number;
}

function gainAndPhase(fn: string, errors: PhasingErrors): { g: number; phi: number } {
  const db = requireFinite(fn, 'amplitudeImbalanceDb', errors.amplitudeImbalanceDb);
  const deg = requireFinite(fn, 'phaseErrorDeg', errors.phaseErrorDeg);
  if (Math.abs(deg) >= 180) {
    throw new RangeError(`${fn}: phaseErrorDeg must be within ±180°, got ${deg}`);
  }
  return { g: 10 ** (db / 20), phi: (deg * Math.PI) / 180 };
}

/**
 * Image (unwanted-sideband) rejection of a phasing modulator with I = cos ωt and
 * Q = g·sin(ωt + φ): wanted/image power ratio
 *   IRR = (1 + 2g·cos φ + g²) / (1 − 2g·cos φ + g²),  g = 10^(dB/20).
 * Evaluated as ((1+g)² − 4g·sin²(φ/2)) / ((1−g)² + 4g·sin²(φ/2)) to avoid cancellation when
 * the errors are small. The result is the same for g and 1/g, so the sign of the imbalance
 * does not matter.
 *
 * Source: phasing-method image-rejection relation (published); worked values (common practice):
 * 1° alone 41.18 dB, 2° 35.16 dB, 0.1 dB alone 44.80 dB, 0.1 dB and 1° 39.61 dB, 0.5 dB and
 * 2° 29.46 dB. Units: dB, degrees → dB. Domain: finite imbalance, |phase| < 180°.
 * Perfect balance gives +Infinity. Bad input: RangeError starting with the function name.
 *
 * @example imageRejectionDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 1 }); // 41.18…
 */
export function imageRejectionDb(errors: PhasingErrors): number {
  const { g, phi } = gainAndPhase('imageRejectionDb', errors);
  const s2 = Math.sin(phi / 2) ** 2;
  const wanted = (1 + g) ** 2 - 4 * g * s2;
  const image = (1 - g) ** 2 + 4 * g * s2;
  return 10 * Math.log10(wanted / image);
}

/**
 * Small-error approximation of the image rejection, IRR ≈ 4/(ε² + θ²) with ε = g − 1 and θ the
 * phase error in radians: an independent check on {@link imageRejectionDb} (common practice).
 * It reads low by about 20·log10(1 + |ε|/2) ≈ 4.3·|ε| dB (0.05 dB at 0.1 dB imbalance) plus a
 * phase term below 0.01 dB up to 5°.
 * Domain and bad input as imageRejectionDb; zero errors give +Infinity.
 *
 * @example imageRejectionSmallErrorDb({ amplitudeImbalanceDb: 0, phaseErrorDeg: 1 }); // 41.18…
 */
export function imageRejectionSmallErrorDb(errors: PhasingErrors): number {
  const { g, phi } = gainAndPhase('imageRejectionSmallErrorDb', errors);
  return 10 * Math.log10(4 / ((g - 1) ** 2 + phi ** 2));
}

/**
 * The phase error that alone (g = 1) explains a suppression S: from IRR = cot²(φ/2),
 * φ = 2·atan(10^(−S/20)), in degrees. S = 0 dB gives 90°, S = +Infinity gives 0°.
 * Source: as imageRejectionDb with g = 1. Domain: S ≥ 0 (or +Infinity).
 * Bad input: RangeError starting with the function name.
 *
 * @example phaseErrorForSuppressionDeg(41.18); // ≈ 1.0
 */
export function phaseErrorForSuppressionDeg(suppressionDb: number): number {
  const fn = 'phaseErrorForSuppressionDeg';
  const s =
    suppressionDb === Infinity ? Infinity : requireNonNegative(fn, 'suppressionDb', suppressionDb);
  return (2 * Math.atan(10 ** (-s / 20)) * 180) / Math.PI;
}

/**
 * The amplitude imbalance that alone (φ = 0) explains a suppression S: from
 * IRR = ((1 + g)/(1 − g))², |imbalance| = 20·log10((r + 1)/(r − 1)) dB with r = 10^(S/20).
 * S = 0 dB gives +Infinity, S = +Infinity gives 0 dB. Returned as a magnitude (≥ 0).
 * Domain: S ≥ 0 (or +Infinity). Bad input: RangeError starting with the function name.
 *
 * @example amplitudeImbalanceForSuppressionDb(44.8); // ≈ 0.1
 */
export function amplitudeImbalanceForSuppressionDb(suppressionDb: number): number {
  const fn = 'amplitudeImbalanceForSuppressionDb';
  const s =
    suppressionDb === Infinity ? Infinity : requireNonNegative(fn, 'suppressionDb', suppressionDb);
  if (s === Infinity) return 0;
  const r = 10 ** (s / 20);
  return 20 * Math.log10((r + 1) / (r - 1));
}
