import { requireFinite, requireLevelDb } from '../units/number-guards';

/**
 * Unwanted-sideband suppression by the single-tone method: with one audio tone applied, the
 * wanted RF tone (which for a single tone is the PEP) and its image mirrored about the carrier
 * are read, S = wanted − image (dB). Positive means the image is below the wanted tone.
 *
 * Source: single-tone method (common practice); limits such as ITU-R M.1173 (ship ≥ 40 dB,
 * coast ≥ 50 dB below PEP, from memory) are stated relative to PEP.
 * Domain: wantedToneDbm finite; imageToneDbm below +Infinity (-Infinity gives +Infinity).
 * Bad input: RangeError starting with the function name.
 *
 * @example unwantedSidebandSuppressionDb({ wantedToneDbm: 47, imageToneDbm: -8 }); // 55
 */
export function unwantedSidebandSuppressionDb(levels: {
  wantedToneDbm: number;
  imageToneDbm: number;
}): number {
  const fn = 'unwantedSidebandSuppressionDb';
  const wanted = requireFinite(fn, 'wantedToneDbm', levels.wantedToneDbm);
  return wanted - requireLevelDb(fn, 'imageToneDbm', levels.imageToneDbm);
}

/**
 * Frequency of the unwanted-sideband image of an RF tone: its mirror about the (suppressed)
 * carrier, f_image = 2·f_carrier − f_tone.
 *
 * Source: SSB spectrum symmetry (common practice). Units: Hz. Domain: finite frequencies.
 * Bad input: RangeError starting with the function name.
 *
 * @example imageFrequencyHz({ carrierHz: 2_182_000, toneHz: 2_183_000 }); // 2181000
 */
export function imageFrequencyHz(frequencies: { carrierHz: number; toneHz: number }): number {
  const carrier = requireFinite('imageFrequencyHz', 'carrierHz', frequencies.carrierHz);
  return 2 * carrier - requireFinite('imageFrequencyHz', 'toneHz', frequencies.toneHz);
}
