import { requireFinite, requireNonNegative } from '../units/number-guards';

/** One point of a measured audio-frequency response: output level at an audio frequency. */
export interface AudioResponsePoint {
  audioHz: number;
  levelDb: number;
}

export interface AudioResponseResult {
  verdict: 'pass' | 'fail';
  /** max − min of the levels inside the passband, dB. */
  variationDb: number;
  /** permitted − measured variation, dB; negative means out of tolerance. */
  marginDb: number;
  maxLevelDb: number;
  minLevelDb: number;
  maxAudioHz: number;
  minAudioHz: number;
  /** How many points fell inside the passband (edges included). */
  pointsInBand: number;
  /** True when points were measured at both passband edges; otherwise the edges were not tested. */
  coversBandEdges: boolean;
}

/**
 * Total amplitude variation of an audio response inside a passband, against a permitted
 * variation: variation = max(level) − min(level) over points with low ≤ f ≤ high.
 *
 * Source: ITU-R M.1173 §3 — audio passband 350–2700 Hz with a total amplitude variation of
 * 6 dB (published). Points are taken as measured; nothing is interpolated, so measure at the
 * band edges (`coversBandEdges` reports whether that was done).
 * Units: Hz, dB (any consistent dB reference). Domain: finite values, low < high,
 * permittedVariationDb ≥ 0, at least two points inside the passband.
 * Bad input: RangeError starting with the function name.
 *
 * @example
 * checkAudioResponse({ points: [{ audioHz: 350, levelDb: -3 }, { audioHz: 1000, levelDb: 0 },
 *   { audioHz: 2700, levelDb: -4 }], passbandLowHz: 350, passbandHighHz: 2700,
 *   permittedVariationDb: 6 }); // variationDb 4, marginDb 2, verdict 'pass'
 */
export function checkAudioResponse(input: {
  points: readonly AudioResponsePoint[];
  passbandLowHz: number;
  passbandHighHz: number;
  permittedVariationDb: number;
}): AudioResponseResult {
  const fn = 'checkAudioResponse';
  const low = requireFinite(fn, 'passbandLowHz', input.passbandLowHz);
  const high = requireFinite(fn, 'passbandHighHz', input.passbandHighHz);
  if (!(low < high)) throw new RangeError(`${fn}: passbandLowHz must be below passbandHighHz`);
  const permitted = requireNonNegative(fn, 'permittedVariationDb', input.permittedVariationDb);
  if (!Array.isArray(input.points)) throw new TypeError(`${fn}: points must be an array`);
  let max = { audioHz: NaN, levelDb: -Infinity };
  let min = { audioHz: NaN, levelDb: Infinity };
  let pointsInBand = 0;
  let atLow = false;
  let atHigh = false;
  input.points.forEach((point, index) => {
    const audioHz = requireFinite(fn, `points[${index}].audioHz`, point.audioHz);
    const levelDb = requireFinite(fn, `points[${index}].levelDb`, point.levelDb);
    if (audioHz < low || audioHz > high) return;
    pointsInBand++;
    atLow ||= audioHz === low;
    atHigh ||= audioHz === high;
    if (levelDb > max.levelDb) max = { audioHz, levelDb };
    if (levelDb < min.levelDb) min = { audioHz, levelDb };
  });
  if (pointsInBand < 2) {
    throw new RangeError(`${fn}: need at least two points inside ${low}–${high} Hz`);
  }
  const variationDb = max.levelDb - min.levelDb;
  const marginDb = permitted - variationDb;
  return {
    verdict: marginDb >= 0 ? 'pass' : 'fail',
    variationDb,
    marginDb,
    maxLevelDb: max.levelDb,
    minLevelDb: min.levelDb,
    maxAudioHz: max.audioHz,
    minAudioHz: min.audioHz,
    pointsInBand,
    coversBandEdges: atLow && atHigh,
  };
}

/** ITU-R M.1173 §3 audio passband and permitted total variation (published). */
export const ITU_R_M1173_AUDIO_RESPONSE = Object.freeze({
  passbandLowHz: 350,
  passbandHighHz: 2700,
  permittedVariationDb: 6,
  source: 'ITU-R M.1173 §3',
});
