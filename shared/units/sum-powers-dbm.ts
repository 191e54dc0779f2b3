import { CompensatedSum } from './compensated-sum';
import { requireArrayLike, requireLevelDb } from './number-guards';

/**
 * Total power of several levels: L = 10·log10(Σ 10^(Li/10)) dBm, summed in linear units with
 * Neumaier compensation so long traces keep their small bins.
 *
 * Source: power addition of uncorrelated signals (common practice); two equal levels add 3.01 dB.
 * Domain: each level a number below +Infinity; -Infinity entries are zero power. An empty list
 * is zero power and returns -Infinity dBm.
 * Bad input: NaN or +Infinity entry → RangeError naming the index; non-array → TypeError.
 *
 * Each term is scaled by the largest level first, so levels far above or below ±300 dBm neither
 * overflow nor underflow.
 *
 * @example sumPowersDbm([-10, -10]); // -6.989700043360187
 */
export function sumPowersDbm(levelsDbm: ArrayLike<number>): number {
  const levels = requireArrayLike('sumPowersDbm', 'levelsDbm', levelsDbm);
  let maxDbm = -Infinity;
  for (let i = 0; i < levels.length; i++) {
    const level = requireLevelDb('sumPowersDbm', `levelsDbm[${i}]`, levels[i]);
    if (level > maxDbm) maxDbm = level;
  }
  if (maxDbm === -Infinity) return -Infinity;
  const acc = new CompensatedSum();
  for (let i = 0; i < levels.length; i++) acc.add(10 ** ((levels[i] - maxDbm) / 10));
  return maxDbm + 10 * Math.log10(acc.value);
}
