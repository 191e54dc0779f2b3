import { requirePositive } from '../units/number-guards';

/** One row of the two-tone test frequencies prescribed for SSB transmitters. */
export interface TwoToneTestPair {
  /** Authorized bandwidth the pair applies to, Hz. */
  authorizedBandwidthHz: number;
  /** Lower audio tone, Hz. */
  tone1Hz: number;
  /** Upper audio tone, Hz. */
  tone2Hz: number;
}

/**
 * Two-tone test audio frequencies for single-sideband transmitters, 47 CFR 2.1049 (the RF
 * components of the two tones shall be equal in magnitude). Edition: the text as published in
 * the eCFR; the year was not recorded when this table was entered — check the edition in force
 * and record it with each test.
 */
export const TWO_TONE_TEST_PAIRS_47CFR_2_1049: readonly TwoToneTestPair[] = Object.freeze([
  { authorizedBandwidthHz: 3000, tone1Hz: 400, tone2Hz: 1800 },
  { authorizedBandwidthHz: 3500, tone1Hz: 500, tone2Hz: 2100 },
  { authorizedBandwidthHz: 4000, tone1Hz: 500, tone2Hz: 2400 },
]);

/**
 * The 47 CFR 2.1049 two-tone pair for an authorized bandwidth, matched exactly.
 * Domain: authorizedBandwidthHz > 0. Bad input or a bandwidth the rule does not list →
 * RangeError starting with the function name (listing the bandwidths it does cover).
 *
 * @example twoToneTestPairFor(3000);
 * // { authorizedBandwidthHz: 3000, tone1Hz: 400, tone2Hz: 1800 }
 */
export function twoToneTestPairFor(authorizedBandwidthHz: number): TwoToneTestPair {
  const bw = requirePositive('twoToneTestPairFor', 'authorizedBandwidthHz', authorizedBandwidthHz);
  const pair = TWO_TONE_TEST_PAIRS_47CFR_2_1049.find((p) => p.authorizedBandwidthHz === bw);
  if (!pair) {
    const listed = TWO_TONE_TEST_PAIRS_47CFR_2_1049.map((p) => p.authorizedBandwidthHz).join(', ');
    throw new RangeError(
      `twoToneTestPairFor: 47 CFR 2.1049 lists no pair for ${bw} Hz (listed: ${listed} Hz)`,
    );
  }
  return pair;
}
