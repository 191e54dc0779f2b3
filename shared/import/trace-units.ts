/** Frequency units accepted in trace headers, with their value in hertz. */
export const FREQUENCY_UNIT_HZ: Readonly<Record<string, number>> = {
  hz: 1,
  khz: 1e3,
  mhz: 1e6,
  ghz: 1e9,
};

/** Level units accepted in trace headers (lower case, micro written as u). */
export type LevelUnit = 'dbm' | 'dbw' | 'dbuv' | 'w' | 'mw';

// dBuV to dBm at 50 ohm: P = V^2/R, so 1 uV gives 10 log10((1e-6)^2 / 50 / 1e-3) = -106.99 dBm
// (IEC 60050 / Rec. ITU-R V.574 relations; 60 dBuV = -46.99 dBm).
const DBUV_TO_DBM_50_OHM = 10 * Math.log10(1e-12 / 50 / 1e-3);

/** True when `unit` (normalized) is a level unit this library converts. */
export function isLevelUnit(unit: string): unit is LevelUnit {
  return unit === 'dbm' || unit === 'dbw' || unit === 'dbuv' || unit === 'w' || unit === 'mw';
}

/**
 * Converts one trace reading to dBm. dBm = 10 log10(P / 1 mW); dBW = dBm - 30; dBuV (into 50
 * ohm) = dBm + 106.99; W and mW are linear powers.
 *
 * @param value the reading in `unit`; linear powers must be > 0 (a log of zero has no dBm value).
 * @returns dBm, or NaN for a linear power <= 0 (the caller reports where it came from).
 * @example levelToDbm(60, 'dbuv') // -46.9897
 * @example levelToDbm(0.1, 'w')   // 20
 */
export function levelToDbm(value: number, unit: LevelUnit): number {
  switch (unit) {
    case 'dbm':
      return value;
    case 'dbw':
      return value + 30;
    case 'dbuv':
      return value + DBUV_TO_DBM_50_OHM;
    case 'w':
      return value > 0 ? 10 * Math.log10(value * 1e3) : NaN;
    case 'mw':
      return value > 0 ? 10 * Math.log10(value) : NaN;
  }
}

/**
 * Puts a unit written in a header into the normalized form used above: lower case, spaces
 * removed, micro sign (U+00B5) and Greek mu (U+03BC) written as `u`, `dBuV` variants such as
 * `dB(uV)` and `dBmicroV` folded together.
 *
 * @example normalizeUnit(' dBµV ') // 'dbuv'
 */
export function normalizeUnit(unit: string): string {
  return unit
    .toLowerCase()
    .replace(/[\u00b5\u03bc]/g, 'u')
    .replace(/\s+/g, '')
    .replace(/^db\(uv\)$|^dbmicrov(olt)?$/, 'dbuv');
}
