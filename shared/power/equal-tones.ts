import { requireFinite } from '../units/number-guards';

/**
 * Mean power and PEP of n equal, non-coherent audio tones in an SSB transmitter: the RF tones
 * have equal power Pt each, so mean = n·Pt (powers add) and PEP = n²·Pt (voltages add at the
 * envelope crest).
 *
 * Source: PEP and mean power as defined in ITU RR 1.157 and 1.158; n-tone relations as published
 * for SSB two-tone testing. For two tones: PEP = Pt + 20·log10(2) dB (6.0206 dB), mean =
 * Pt + 10·log10(2) dB (3.0103 dB), PEP/mean = 3.0103 dB. Exact logarithms are used, not 6.02/3.01.
 */
export interface ToneSumLevels {
  /** Peak envelope power, dBm. */
  pepDbm: number;
  /** Mean power over many modulation cycles, dBm. */
  meanDbm: number;
}

/** 20·log10(2): the PEP of two equal tones above one tone, dB. */
export const TWO_TONE_PEP_ABOVE_TONE_DB = 20 * Math.log10(2);
/** 10·log10(2): the mean power of two equal tones above one tone, dB. */
export const TWO_TONE_MEAN_ABOVE_TONE_DB = 10 * Math.log10(2);

/**
 * PEP and mean power of `toneCount` equal tones each at `toneDbm`.
 * Domain: toneDbm finite; toneCount an integer ≥ 1.
 * Bad input: RangeError (TypeError for non-numbers), message starting with the function name.
 *
 * @example equalTonesFromToneDbm(-10, 3); // { pepDbm: -0.457..., meanDbm: -5.228... }
 */
export function equalTonesFromToneDbm(toneDbm: number, toneCount: number): ToneSumLevels {
  const tone = requireFinite('equalTonesFromToneDbm', 'toneDbm', toneDbm);
  const n = requireFinite('equalTonesFromToneDbm', 'toneCount', toneCount);
  if (!Number.isInteger(n) || n < 1) {
    throw new RangeError(`equalTonesFromToneDbm: toneCount must be an integer ≥ 1, got ${n}`);
  }
  return { pepDbm: tone + 20 * Math.log10(n), meanDbm: tone + 10 * Math.log10(n) };
}

/**
 * PEP and mean power of a two-tone test signal from the level of one tone.
 * Domain: finite toneDbm. Bad input: RangeError starting with the function name.
 *
 * @example twoToneFromToneDbm(-10); // { pepDbm: -3.979400086720376, meanDbm: -6.989700043360188 }
 */
export function twoToneFromToneDbm(toneDbm: number): ToneSumLevels {
  const tone = requireFinite('twoToneFromToneDbm', 'toneDbm', toneDbm);
  return {
    pepDbm: tone + TWO_TONE_PEP_ABOVE_TONE_DB,
    meanDbm: tone + TWO_TONE_MEAN_ABOVE_TONE_DB,
  };
}

/**
 * Level of each tone of a two-tone signal with the given PEP: tone = PEP − 20·log10(2).
 * Domain: finite pepDbm. Bad input: RangeError starting with the function name.
 *
 * @example toneDbmFromTwoTonePepDbm(50); // 43.979400086720375
 */
export function toneDbmFromTwoTonePepDbm(pepDbm: number): number {
  return requireFinite('toneDbmFromTwoTonePepDbm', 'pepDbm', pepDbm) - TWO_TONE_PEP_ABOVE_TONE_DB;
}
