import { TWO_TONE_PEP_ABOVE_TONE_DB } from '../power/equal-tones';
import { requireFinite, requireLevelDb } from '../units/number-guards';

/**
 * An intermodulation product's level expressed both ways it is quoted: below one of the two
 * (equal) tones and below PEP. Both are positive when the product is below the reference.
 *
 *   belowToneDb = tone − product
 *   belowPepDb  = PEP − product, where PEP = tone + 20·log10(2) unless a measured PEP is given
 *
 * Source: IMD relative to PEP = IMD relative to one tone − 6.02 dB (published practice; for
 * example −25 dB re tone = −31.02 dB re PEP). The exact 20·log10(2) is used. Store which
 * reference a reading uses and never convert silently (common practice).
 * Domain: toneDbm and pepDbm finite; productDbm below +Infinity.
 * Bad input: RangeError starting with the function name.
 *
 * @example imdRelativeDb({ productDbm: 15, toneDbm: 40 });
 * // { belowToneDb: 25, belowPepDb: 31.0206 }
 */
export function imdRelativeDb(levels: { productDbm: number; toneDbm: number; pepDbm?: number }): {
  belowToneDb: number;
  belowPepDb: number;
} {
  const fn = 'imdRelativeDb';
  const product = requireLevelDb(fn, 'productDbm', levels.productDbm);
  const tone = requireFinite(fn, 'toneDbm', levels.toneDbm);
  const pep =
    levels.pepDbm === undefined
      ? tone + TWO_TONE_PEP_ABOVE_TONE_DB
      : requireFinite(fn, 'pepDbm', levels.pepDbm);
  return { belowToneDb: tone - product, belowPepDb: pep - product };
}
