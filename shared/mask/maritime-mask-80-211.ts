import { spuriousLimitDb } from '../measurements/spurious-limit';
import { requirePositive } from '../units/number-guards';
import type { EmissionMask } from './emission-mask';

/**
 * The maritime emission mask of 47 CFR 80.211(a) for H3E, J3E and R3E emissions, relative to
 * the MEAN power P, with offsets from the assigned frequency in percent of the authorized
 * bandwidth B (published):
 * - more than 50 % up to and including 150 % of B: at least 28 dB below P (25 dB for
 *   transmitters installed before 1 February 1992);
 * - more than 150 % up to and including 250 %: at least 35 dB;
 * - more than 250 %: at least 43 + 10·log10(P/W) dB.
 * "Up to and including" puts an emission exactly at 150 % in the 28 dB region and one exactly
 * at 250 % in the 35 dB region; within 50 % the rule sets no limit (exempt band). With
 * B = 3.0 kHz the regions are 1.5–4.5 kHz, 4.5–7.5 kHz and beyond 7.5 kHz.
 *
 * Centre the check on the assigned frequency (for maritime J3E this is 1400 Hz above the
 * carrier frequency — from memory, verify against the rule in force).
 * Units: Hz, W. Domain: authorizedBandwidthHz > 0, meanPowerW > 0.
 * Bad input: RangeError starting with the function name.
 *
 * @example maritimeMask80211({ authorizedBandwidthHz: 3000, meanPowerW: 100 }).vertices;
 * // [[0,0],[1500,0],[1500,-28],[4500,-28],[4500,-35],[7500,-35],[7500,-63]]
 */
export function maritimeMask80211(rule: {
  authorizedBandwidthHz: number;
  meanPowerW: number;
  installedBefore1992?: boolean;
  /** Edition of 47 CFR Part 80 the lab applies, stored with the result. */
  edition?: string;
}): EmissionMask {
  const fn = 'maritimeMask80211';
  const bw = requirePositive(fn, 'authorizedBandwidthHz', rule.authorizedBandwidthHz);
  const meanPowerW = requirePositive(fn, 'meanPowerW', rule.meanPowerW);
  const nearDb = rule.installedBefore1992 === true ? 25 : 28;
  const farDb = spuriousLimitDb({ meanPowerW });
  return {
    reference: 'mean',
    exemptWithinOffsetHz: 0.5 * bw,
    vertices: [
      [0, 0],
      [0.5 * bw, 0],
      [0.5 * bw, -nearDb],
      [1.5 * bw, -nearDb],
      [1.5 * bw, -35],
      [2.5 * bw, -35],
      [2.5 * bw, -farDb],
    ],
    provenance: {
      title: 'Maritime SSB emission limits (H3E, J3E, R3E)',
      source: '47 CFR 80.211(a)',
      edition: rule.edition ?? 'edition not recorded: confirm the edition in force and store it',
      status: 'published',
      notes: [
        'Relative to mean power; offsets from the assigned frequency in % of authorized bandwidth.',
        `Authorized bandwidth ${bw} Hz; mean power ${meanPowerW} W; ` +
          `beyond 250 %: ${farDb.toFixed(2)} dB.`,
        '"Up to and including": exactly 150 % is in the 28 dB region, ' +
          'exactly 250 % in the 35 dB region.',
        rule.installedBefore1992 === true
          ? 'Installed before 1 February 1992: 25 dB applies from 50 % to 150 %.'
          : 'Installed on or after 1 February 1992: 28 dB applies from 50 % to 150 %.',
      ],
    },
  };
}
