import { requirePositive } from '../units/number-guards';

/** Largest noise bandwidth wanted for the carrier reading, Hz: the top of the 10–30 Hz practice. */
export const CARRIER_RBW_LIMIT_HZ = 30;

/** Hann's equivalent noise bandwidth, bins (Harris 1978). */
const HANN_ENBW_BINS = 1.5;

/**
 * Default Welch segment length for analysing a capture: the smallest power of two whose Hann
 * bin noise bandwidth 1.5·fs/N is at most 30 Hz, clamped to 16 … 131072. A carrier must be read
 * with a narrow resolution bandwidth (10–30 Hz, common practice) so the tones' skirts do not
 * hide it; 192 kS/s gives N = 16384 (11.7 Hz bins, 17.6 Hz noise bandwidth).
 *
 * Source: Hann ENBW 1.5 bins (Harris, Proc. IEEE 66(1), 1978); RBW range common practice.
 * Units: Hz in, samples out. Domain: finite sampleRateHz > 0.
 * Bad input: RangeError starting with "defaultSegmentLength".
 *
 * @example defaultSegmentLength(192000); // 16384
 */
export function defaultSegmentLength(sampleRateHz: number): number {
  const fs = requirePositive('defaultSegmentLength', 'sampleRateHz', sampleRateHz);
  let n = 16;
  while (n < 131072 && (HANN_ENBW_BINS * fs) / n > CARRIER_RBW_LIMIT_HZ) n *= 2;
  return n;
}
