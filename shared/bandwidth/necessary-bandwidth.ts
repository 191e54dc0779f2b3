import { requireFinite } from '../units/number-guards';

/**
 * Necessary bandwidth of single-sideband telephony from its audio band.
 *
 * Source: ITU RR Appendix 1 / ITU-R SM.1138 worked examples (published): suppressed carrier
 * (J3E) Bn = M − lowest modulation frequency, 3000 − 300 Hz → 2K70J3E; full carrier (H3E)
 * Bn = M, the highest modulation frequency → 3K00H3E.
 * Units: Hz. Domain: 0 ≤ low < high, finite. Bad input: RangeError starting with the name.
 */

/** @example j3eNecessaryBandwidthHz(300, 3000); // 2700 */
export function j3eNecessaryBandwidthHz(lowAudioHz: number, highAudioHz: number): number {
  const fn = 'j3eNecessaryBandwidthHz';
  const low = requireFinite(fn, 'lowAudioHz', lowAudioHz);
  const high = requireFinite(fn, 'highAudioHz', highAudioHz);
  if (!(low >= 0 && low < high)) {
    throw new RangeError(`${fn}: need 0 ≤ lowAudioHz < highAudioHz, got ${low} and ${high}`);
  }
  return high - low;
}

/** @example h3eNecessaryBandwidthHz(3000); // 3000 */
export function h3eNecessaryBandwidthHz(highAudioHz: number): number {
  const high = requireFinite('h3eNecessaryBandwidthHz', 'highAudioHz', highAudioHz);
  if (!(high > 0)) {
    throw new RangeError(`h3eNecessaryBandwidthHz: highAudioHz must be > 0, got ${high}`);
  }
  return high;
}
