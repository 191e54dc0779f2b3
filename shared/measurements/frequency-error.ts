import { requireFinite, requirePositive } from '../units/number-guards';

/**
 * Frequency error of a transmitter: Δf = measured − nominal (Hz), and the same relative to the
 * nominal frequency in ppm, Δf / f_nominal · 10⁶. Positive means the transmitter is high.
 *
 * Source: definition of frequency tolerance (47 CFR 2.1055, 80.209; ITU RR Appendix 2);
 * 20 Hz at 16.42 MHz = 1.218 ppm (arithmetic).
 * Domain: finite frequencies; nominalHz > 0 for the ppm form.
 * Bad input: RangeError starting with the function name.
 */

/** @example frequencyErrorHz({ measuredHz: 2_182_012, nominalHz: 2_182_000 }); // 12 */
export function frequencyErrorHz(reading: { measuredHz: number; nominalHz: number }): number {
  const measured = requireFinite('frequencyErrorHz', 'measuredHz', reading.measuredHz);
  return measured - requireFinite('frequencyErrorHz', 'nominalHz', reading.nominalHz);
}

/** @example frequencyErrorPpm({ measuredHz: 16_420_020, nominalHz: 16_420_000 }); // ≈ 1.21803 */
export function frequencyErrorPpm(reading: { measuredHz: number; nominalHz: number }): number {
  const measured = requireFinite('frequencyErrorPpm', 'measuredHz', reading.measuredHz);
  const nominal = requirePositive('frequencyErrorPpm', 'nominalHz', reading.nominalHz);
  return ((measured - nominal) / nominal) * 1e6;
}
