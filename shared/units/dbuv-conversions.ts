import { requireFinite, requirePositive } from './number-guards';

/**
 * Conversions between a voltage level in dBµV and a power level in dBm across a resistance R.
 *
 * From P = V²/R with V = 10^(dBµV/20) µV:
 *   dBm = 10·log10(V²/R / 1 mW) = dBµV − 120 − 10·log10(R/Ω) + 30 = dBµV − 90 − 10·log10(R/Ω).
 * At 50 Ω the offset is 90 + 16.9897 = 106.9897 dB (the "dBµV = dBm + 107" rule of thumb).
 *
 * Source: definitions of dBm and dBµV (ITU-R V.574) and P = V²/R; 60 dBµV ↔ −46.99 dBm at 50 Ω.
 * Domain: finite levels; impedanceOhm finite and > 0 (default 50 Ω).
 * Bad input: non-finite level or impedance ≤ 0 → RangeError; non-number → TypeError.
 */
function offsetDb(fnName: string, impedanceOhm: number): number {
  return 90 + 10 * Math.log10(requirePositive(fnName, 'impedanceOhm', impedanceOhm));
}

/** dBm from dBµV across `impedanceOhm`. @example dbuvToDbm(60); // -46.98970004336019 */
export function dbuvToDbm(levelDbuv: number, impedanceOhm = 50): number {
  const level = requireFinite('dbuvToDbm', 'levelDbuv', levelDbuv);
  return level - offsetDb('dbuvToDbm', impedanceOhm);
}

/** dBµV from dBm across `impedanceOhm`. @example dbmToDbuv(-46.98970004336019); // 60 */
export function dbmToDbuv(levelDbm: number, impedanceOhm = 50): number {
  const level = requireFinite('dbmToDbuv', 'levelDbm', levelDbm);
  return level + offsetDb('dbmToDbuv', impedanceOhm);
}
