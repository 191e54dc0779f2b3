import { requirePositive, requireNonNegative } from '../units/number-guards';

/**
 * Peak envelope power from the peak RF voltage across a resistive load at SWR 1:
 * PEP = (Vpk/√2)² / R = Vpk² / (2R) — the RMS voltage of the RF cycle at the envelope crest.
 *
 * Source: published relation PEP = (Vpk · 0.707)² / R (RR 1.157 definition of PEP);
 * 100 V peak into 50 Ω → 100 W. The exact 1/√2 is used rather than 0.707.
 * Units: volts, ohms → watts. Domain: peakV ≥ 0 finite, resistanceOhm > 0 finite.
 * Bad input: RangeError (TypeError for non-numbers) starting with the function name.
 *
 * @example pepFromPeakVoltageW(100, 50); // 100
 */
export function pepFromPeakVoltageW(peakV: number, resistanceOhm: number): number {
  const v = requireNonNegative('pepFromPeakVoltageW', 'peakV', peakV);
  const r = requirePositive('pepFromPeakVoltageW', 'resistanceOhm', resistanceOhm);
  return (v * v) / (2 * r);
}
