import { requireFinite } from '../units/number-guards';
import {
  amplitudeImbalanceForSuppressionDb,
  imageRejectionDb,
  phaseErrorForSuppressionDeg,
} from './image-rejection';
import type { PhasingErrors } from './image-rejection';

export interface PhasingDiagnosis {
  meetsRequirement: boolean;
  /** Phase error that alone (perfect amplitude balance) explains the measurement, °. */
  phaseErrorAloneDeg: number;
  /** Amplitude imbalance that alone (perfect quadrature) explains the measurement, dB. */
  amplitudeImbalanceAloneDb: number;
  /** A tolerance pair that meets the requirement with the two errors sharing it equally. */
  tolerancePair: PhasingErrors;
  /** Image rejection the tolerance pair gives exactly, dB (≈ the requirement). */
  tolerancePairRejectionDb: number;
  explanation: string;
}

/**
 * Explains a measured unwanted-sideband suppression of a phasing-method transmitter in terms of
 * modulator errors, and gives the errors a design must hold to meet a requirement.
 * The bounds are the single errors that alone would explain the reading (any mix of smaller
 * errors can too). The tolerance pair gives each error half of the permitted image power: each
 * alone would give the requirement + 10·log10(2) dB; for 40 dB that is about 0.12 dB and 0.81°.
 *
 * Source: phasing-method image-rejection relation (published), small-error form
 * IRR ≈ 4/(ε² + θ²) for the equal split (common practice). Hilbert-filter ripple across the
 * audio band counts as amplitude error, its phase deviation as phase error.
 * Units: dB, degrees. Domain: measuredSuppressionDb ≥ 0 (or +Infinity); requiredDb > 0 finite.
 * Bad input: RangeError starting with the function name.
 *
 * @example diagnosePhasing({ measuredSuppressionDb: 35.16, requiredDb: 40 }).phaseErrorAloneDeg;
 * // ≈ 2.0
 */
export function diagnosePhasing(
  input: { measuredSuppressionDb: number; requiredDb: number },
): PhasingDiagnosis {
  const fn = 'diagnosePhasing';
  const measured = input.measuredSuppressionDb;
  if (!(measured === Infinity || (Number.isFinite(measured) && measured >= 0))) {
    throw new RangeError(`${fn}: measuredSuppressionDb must be ≥ 0, got ${String(measured)}`);
  }
  const required = requireFinite(fn, 'requiredDb', input.requiredDb);
  if (!(required > 0)) {
    throw new RangeError(`${fn}: requiredDb must be greater than 0, got ${required}`);
  }
  const phaseErrorAloneDeg = phaseErrorForSuppressionDeg(measured);
  const amplitudeImbalanceAloneDb = amplitudeImbalanceForSuppressionDb(measured);
  const eachAloneDb = required + 10 * Math.log10(2);
  const tolerancePair = {
    amplitudeImbalanceDb: amplitudeImbalanceForSuppressionDb(eachAloneDb),
    phaseErrorDeg: phaseErrorForSuppressionDeg(eachAloneDb),
  };
  const meetsRequirement = measured >= required;
  const verb = meetsRequirement ? 'meets' : 'does not meet';
  const explanation =
    `The measured suppression of ${measured.toFixed(2)} dB ${verb} ` +
    `the required ${required.toFixed(2)} dB. It is what a phase error of ` +
    `${phaseErrorAloneDeg.toFixed(2)}° alone (perfect amplitude balance), or an amplitude ` +
    `imbalance of ${amplitudeImbalanceAloneDb.toFixed(3)} dB alone ` +
    '(perfect 90° phasing), would give; smaller errors of both kinds together give the same. ' +
    `To reach ${required.toFixed(2)} dB, hold the I/Q amplitude match within about ` +
    `${tolerancePair.amplitudeImbalanceDb.toFixed(2)} dB and the phase within about ` +
    `${tolerancePair.phaseErrorDeg.toFixed(2)}° across the whole audio band; ` +
    'ripple of the Hilbert filter counts as amplitude error.';
  return {
    meetsRequirement,
    phaseErrorAloneDeg,
    amplitudeImbalanceAloneDb,
    tolerancePair,
    tolerancePairRejectionDb: imageRejectionDb(tolerancePair),
    explanation,
  };
}
