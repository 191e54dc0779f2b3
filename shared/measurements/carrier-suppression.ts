import { requireFinite, requireLevelDb } from '../units/number-guards';

/**
 * Carrier suppression of a J3E emission: how far the residual carrier lies below PEP,
 * S = PEP − carrier (dB). Positive means the carrier is below PEP.
 *
 * Source: the limits are stated as "dB below peak envelope power" (47 CFR 80.207(c): J3E carrier
 * at least 40 dB below PEP; 47 CFR 87.141(d): aircraft 26 dB, ground 40 dB). Measure the carrier
 * with a narrow RBW (10–30 Hz) so the tone skirts do not mask it (common practice).
 * Units: dBm in, dB out. Domain: pepDbm finite; carrierDbm below +Infinity (-Infinity, no
 * measurable carrier, gives +Infinity).
 * Bad input: RangeError starting with the function name.
 *
 * @example carrierSuppressionDb({ pepDbm: 50, carrierDbm: 5.5 }); // 44.5
 */
export function carrierSuppressionDb(levels: { pepDbm: number; carrierDbm: number }): number {
  const pep = requireFinite('carrierSuppressionDb', 'pepDbm', levels.pepDbm);
  const carrier = requireLevelDb('carrierSuppressionDb', 'carrierDbm', levels.carrierDbm);
  return pep - carrier;
}
