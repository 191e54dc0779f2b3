import { requirePositive } from '../units/number-guards';

/**
 * Correction that scales a noise-like level measured in one bandwidth to another:
 * ΔL = 10·log10(B_reference / B_measured) dB. Noise-like emissions scale with bandwidth; a CW
 * tone does not and must not be corrected.
 *
 * Source: bandwidth scaling of noise-like emissions, 10·log10(B2/B1) (published relation; used
 * with reference bandwidths such as the 10 kHz of RR Appendix 3 for 150 kHz–30 MHz).
 * 300 Hz → 4 kHz: +11.25 dB.
 * Units: Hz → dB. Domain: both bandwidths finite and > 0.
 * Bad input: RangeError starting with the function name.
 *
 * @example noiseBandwidthCorrectionDb(4000, 300); // 11.249387366083
 */
export function noiseBandwidthCorrectionDb(referenceBandwidthHz: number, rbwHz: number): number {
  const fn = 'noiseBandwidthCorrectionDb';
  const reference = requirePositive(fn, 'referenceBandwidthHz', referenceBandwidthHz);
  return 10 * Math.log10(reference / requirePositive(fn, 'rbwHz', rbwHz));
}
