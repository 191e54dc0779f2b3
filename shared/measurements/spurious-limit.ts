import { requireFinite, requirePositive } from '../units/number-guards';

/** How a fixed dBc figure combines with the 43 + 10·log10(P) formula. */
export type SpuriousCapRule = 'less-stringent' | 'more-stringent';

/**
 * Required attenuation of a spurious emission below the reference power P:
 *
 *   A = baseDb + 10·log10(P / 1 W)    (baseDb = 43 by default)
 *
 * optionally combined with a fixed figure capDbc: 'less-stringent' takes the smaller attenuation
 * (min), 'more-stringent' the larger (max).
 *
 * Source: the 43 + 10·log10(P) form of 47 CFR 80.211(a)(3), 87.139 and RR Appendix 3 (whose
 * "or 70 dBc / 60 dBc / 50 dB, whichever is less stringent" rows are from memory — verify each
 * row against the edition in force). P = 1, 10, 100, 1000 W → 43, 53, 63, 73 dB. For baseDb = 43
 * the limit is the absolute level −13 dBm whatever P (common practice), see
 * {@link spuriousLimitAbsoluteDbm}.
 * Units: W in, dB out. Domain: meanPowerW > 0; baseDb, capDbc finite.
 * Bad input: RangeError starting with the function name.
 *
 * Which power P is depends on the rule: mean power (80.211) or PEP for SSB under RR Appendix 3.
 *
 * @example spuriousLimitDb({ meanPowerW: 100 }); // 63
 * @example spuriousLimitDb({ meanPowerW: 1e5, capDbc: 70, capRule: 'less-stringent' }); // 70
 */
export function spuriousLimitDb(rule: {
  meanPowerW: number;
  baseDb?: number;
  capDbc?: number;
  capRule?: SpuriousCapRule;
}): number {
  const fn = 'spuriousLimitDb';
  const power = requirePositive(fn, 'meanPowerW', rule.meanPowerW);
  const base = requireFinite(fn, 'baseDb', rule.baseDb ?? 43);
  const formulaDb = base + 10 * Math.log10(power);
  if (rule.capDbc === undefined) return formulaDb;
  const cap = requireFinite(fn, 'capDbc', rule.capDbc);
  const capRule = rule.capRule ?? 'less-stringent';
  if (capRule === 'less-stringent') return Math.min(formulaDb, cap);
  if (capRule === 'more-stringent') return Math.max(formulaDb, cap);
  throw new RangeError(`${fn}: capRule must be 'less-stringent' or 'more-stringent'`);
}

/**
 * The absolute spurious limit, dBm, that an attenuation requirement of A dB below P implies:
 * L = P(dBm) − A. For A = 43 + 10·log10(P/W) this is −13 dBm for every P (common practice).
 *
 * Domain: referencePowerW > 0, requiredAttenuationDb finite. Bad input: RangeError.
 *
 * @example spuriousLimitAbsoluteDbm({ referencePowerW: 100, requiredAttenuationDb: 63 }); // -13
 */
export function spuriousLimitAbsoluteDbm(limit: {
  referencePowerW: number;
  requiredAttenuationDb: number;
}): number {
  const fn = 'spuriousLimitAbsoluteDbm';
  const power = requirePositive(fn, 'referencePowerW', limit.referencePowerW);
  const attenuation = requireFinite(fn, 'requiredAttenuationDb', limit.requiredAttenuationDb);
  return 10 * Math.log10(power) + 30 - attenuation;
}
