import { requireFinite, requireLevelDb, requireNonNegative } from './number-guards';

/**
 * Conversions between absolute power levels. dBm = 10·log10(P / 1 mW); dBW = 10·log10(P / 1 W),
 * so dBW = dBm − 30.
 *
 * Source: definitions of dBm and dBW (ITU-R V.574, absolute power levels).
 * Policy: a level of -Infinity is zero power and is accepted; NaN and +Infinity levels throw a
 * RangeError. Powers must be finite and ≥ 0 (0 W ↔ -Infinity dBm). Non-numbers throw a TypeError.
 */

/** Power in watts from dBm: P = 10^((L − 30)/10). @example dbmToWatts(30); // 1 */
export function dbmToWatts(levelDbm: number): number {
  return 10 ** ((requireLevelDb('dbmToWatts', 'levelDbm', levelDbm) - 30) / 10);
}

/** Level in dBm from watts: L = 10·log10(P) + 30. @example wattsToDbm(100); // 50 */
export function wattsToDbm(powerW: number): number {
  return 10 * Math.log10(requireNonNegative('wattsToDbm', 'powerW', powerW)) + 30;
}

/** Power in milliwatts from dBm: P = 10^(L/10). @example dbmToMilliwatts(-10); // 0.1 */
export function dbmToMilliwatts(levelDbm: number): number {
  return 10 ** (requireLevelDb('dbmToMilliwatts', 'levelDbm', levelDbm) / 10);
}

/** Level in dBm from milliwatts: L = 10·log10(P). @example milliwattsToDbm(1); // 0 */
export function milliwattsToDbm(powerMw: number): number {
  return 10 * Math.log10(requireNonNegative('milliwattsToDbm', 'powerMw', powerMw));
}

/** dBW from dBm: dBW = dBm − 30. Finite input only. @example dbmToDbw(43); // 13 */
export function dbmToDbw(levelDbm: number): number {
  return requireFinite('dbmToDbw', 'levelDbm', levelDbm) - 30;
}

/** dBm from dBW: dBm = dBW + 30. Finite input only. @example dbwToDbm(13); // 43 */
export function dbwToDbm(levelDbw: number): number {
  return requireFinite('dbwToDbm', 'levelDbw', levelDbw) + 30;
}
