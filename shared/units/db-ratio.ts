import { requireLevelDb, requireNonNegative } from './number-guards';

/**
 * Power ratio from decibels: r = 10^(dB/10).
 *
 * Source: definition of the decibel for power quantities (IEC 60027-3; ITU-R V.574).
 * Domain: any dB value below +Infinity; -Infinity gives 0.
 * Bad input: NaN or +Infinity → RangeError; non-number → TypeError.
 *
 * @example dbToLinearPower(10); // 10
 */
export function dbToLinearPower(db: number): number {
  return 10 ** (requireLevelDb('dbToLinearPower', 'db', db) / 10);
}

/**
 * Decibels from a power ratio: dB = 10·log10(r).
 *
 * Source: as {@link dbToLinearPower}.
 * Domain: r ≥ 0 and finite; r = 0 gives -Infinity.
 * Bad input: negative, NaN or infinite → RangeError; non-number → TypeError.
 *
 * @example linearPowerToDb(2); // 3.0102999566398116
 */
export function linearPowerToDb(ratio: number): number {
  return 10 * Math.log10(requireNonNegative('linearPowerToDb', 'ratio', ratio));
}
