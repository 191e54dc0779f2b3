import { requireFinite } from '../units/number-guards';
import type { EmissionMask } from './emission-mask';

/** Offset of the assigned frequency above the carrier for aeronautical HF SSB, Hz (from memory). */
export const AVIATION_ASSIGNED_FREQUENCY_OFFSET_HZ = 1400;

/**
 * Aircraft-station SSB emission mask of 47 CFR 87.139(c) / RR Appendix 27 (transmitters
 * installed after 1 February 1983), relative to PEP, offsets from the assigned frequency
 * (carrier + 1400 Hz). FROM MEMORY — verify against the current edition before relying on it:
 * - more than 1.5 kHz up to and including 4.5 kHz: at least 30 dB below PEP;
 * - more than 4.5 kHz up to and including 7.5 kHz: at least 38 dB;
 * - more than 7.5 kHz: at least 43 dB (aircraft stations; aeronautical stations use a
 *   power-dependent figure, not shipped here).
 * Within 1.5 kHz the rule sets no limit (exempt band).
 */
export const AVIATION_SSB_AIRCRAFT_MASK_87_139C: EmissionMask = Object.freeze({
  reference: 'pep' as const,
  exemptWithinOffsetHz: 1500,
  vertices: Object.freeze([
    Object.freeze([0, 0] as const),
    Object.freeze([1500, 0] as const),
    Object.freeze([1500, -30] as const),
    Object.freeze([4500, -30] as const),
    Object.freeze([4500, -38] as const),
    Object.freeze([7500, -38] as const),
    Object.freeze([7500, -43] as const),
  ]),
  provenance: Object.freeze({
    title: 'Aeronautical HF SSB emission limits, aircraft stations',
    source: '47 CFR 87.139(c); ITU RR Appendix 27',
    edition: 'from memory, verify against current edition',
    status: 'from-memory' as const,
    notes: Object.freeze([
      'Relative to PEP; offsets from the assigned frequency, which is the carrier + 1400 Hz.',
      '"Up to and including": exactly 4.5 kHz is in the 30 dB region, ' +
        'exactly 7.5 kHz in the 38 dB region.',
      'Numbers recalled, not checked against the text: verify against the current edition.',
    ]),
  }),
});

/**
 * The assigned frequency of an aeronautical HF SSB channel from its carrier frequency:
 * f_assigned = f_carrier + 1400 Hz (RR Appendix 27 channelling, from memory).
 * Units: Hz. Domain: finite carrierHz. Bad input: RangeError starting with the function name.
 *
 * @example aviationAssignedFrequencyHz(8_891_000); // 8892400
 */
export function aviationAssignedFrequencyHz(carrierHz: number): number {
  const carrier = requireFinite('aviationAssignedFrequencyHz', 'carrierHz', carrierHz);
  return carrier + AVIATION_ASSIGNED_FREQUENCY_OFFSET_HZ;
}
