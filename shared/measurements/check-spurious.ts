import { requireFinite, requireLevelDb } from '../units/number-guards';

/** One measured emission found in a spurious-emission search. */
export interface SpuriousEmission {
  frequencyHz: number;
  levelDbm: number;
}

/** The outcome for one emission. */
export interface SpuriousRow extends SpuriousEmission {
  /** How far the emission lies below the reference power, dB. */
  attenuationDb: number;
  /** attenuation − required attenuation, dB; negative means the emission exceeds the limit. */
  marginDb: number;
  pass: boolean;
}

export interface SpuriousCheckResult {
  verdict: 'pass' | 'fail';
  /** Absolute limit implied by the requirement, dBm (reference − required attenuation). */
  limitDbm: number;
  rows: SpuriousRow[];
  worstMarginDb: number;
  worstFrequencyHz: number;
  worstIndex: number;
}

/**
 * Checks measured spurious emissions against a required attenuation below a reference power:
 * attenuation_i = reference − level_i, margin_i = attenuation_i − required. The worst emission
 * is the one with the smallest margin (the first such in list order on a tie).
 *
 * Source: limits stated as "at least A dB below P" (47 CFR 80.211(a)(3), RR Appendix 3); obtain
 * A from {@link spuriousLimitDb}. A margin of exactly 0 passes ("at least").
 * Units: dBm, dB, Hz. Domain: referencePowerDbm and requiredAttenuationDb finite; at least one
 * emission (record the highest reading of the search, even the noise floor, so the margin is
 * known); each level below +Infinity, each frequency finite.
 * Bad input: RangeError (TypeError for a non-array) starting with the function name.
 *
 * @example
 * checkSpurious({ referencePowerDbm: 50, requiredAttenuationDb: 63,
 *   emissions: [{ frequencyHz: 4.364e6, levelDbm: -20 }] });
 * // verdict 'pass', limitDbm -13, worstMarginDb 7
 */
export function checkSpurious(input: {
  emissions: readonly SpuriousEmission[];
  referencePowerDbm: number;
  requiredAttenuationDb: number;
}): SpuriousCheckResult {
  const fn = 'checkSpurious';
  const reference = requireFinite(fn, 'referencePowerDbm', input.referencePowerDbm);
  const required = requireFinite(fn, 'requiredAttenuationDb', input.requiredAttenuationDb);
  if (!Array.isArray(input.emissions)) throw new TypeError(`${fn}: emissions must be an array`);
  if (input.emissions.length === 0) {
    throw new RangeError(`${fn}: emissions is empty; record at least the highest reading found`);
  }
  let worstIndex = 0;
  const rows = input.emissions.map((emission, index): SpuriousRow => {
    const frequencyHz = requireFinite(fn, `emissions[${index}].frequencyHz`, emission.frequencyHz);
    const levelDbm = requireLevelDb(fn, `emissions[${index}].levelDbm`, emission.levelDbm);
    const attenuationDb = reference - levelDbm;
    const marginDb = attenuationDb - required;
    return { frequencyHz, levelDbm, attenuationDb, marginDb, pass: marginDb >= 0 };
  });
  rows.forEach((row, index) => {
    if (row.marginDb < rows[worstIndex].marginDb) worstIndex = index;
  });
  const worst = rows[worstIndex];
  return {
    verdict: rows.every((row) => row.pass) ? 'pass' : 'fail',
    limitDbm: reference - required,
    rows,
    worstMarginDb: worst.marginDb,
    worstFrequencyHz: worst.frequencyHz,
    worstIndex,
  };
}
