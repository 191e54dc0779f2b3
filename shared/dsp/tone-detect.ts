import { requireFinite } from '../units/number-guards';
import { lobePower } from './band-power';
import { peakOffsetBins, type PeakInterpolation } from './peak-interpolation';
import { requirePowerSpectrum, type PowerSpectrum } from './power-spectrum';

/** A tone found in a PSD. */
export interface DetectedTone {
  frequencyHz: number;
  /** Main-lobe integral of the PSD: the tone's power in the PSD's units × Hz. */
  powerLinear: number;
  /** 10·log10(powerLinear): dBFS when the samples are full-scale normalized. */
  levelDb: number;
}

/** Options of {@link detectTones}; every field has a default. */
export interface ToneDetectOptions {
  /** How far a peak's PSD must stand above the floor, dB; default 10. */
  thresholdDb?: number;
  /** Floor PSD (linear, per Hz); default the median of the PSD (robust noise-floor estimate). */
  floorPsd?: number;
  /** Main-lobe half width in bins for the power integral and the local-maximum test; default 3. */
  halfWidthBins?: number;
  /** Minimum distance between reported tones, Hz; default (2·halfWidthBins + 1) bins. */
  minSpacingHz?: number;
  /** At most this many tones (the strongest); default 32. */
  maxTones?: number;
  refine?: PeakInterpolation;
  /** Search only bins with centres in [fromHz, toHz]; default the whole grid. */
  fromHz?: number;
  toHz?: number;
}

/**
 * Finds tones in a PSD: bins that are the maximum of their ±halfWidthBins neighbourhood and
 * stand thresholdDb above the floor, strongest first, keeping only those at least minSpacingHz
 * from a stronger one. Each tone's power is the PSD integrated over its main lobe, which with a
 * Welch (Σw²-normalized) PSD is the true tone power wherever the tone falls in its bin (no
 * scalloping); its frequency is refined between bins by the chosen interpolation (default
 * 'gaussian').
 *
 * Source: peak picking and main-lobe integration, common practice; interpolation as
 * {@link peakOffsetBins}. Units: Hz; power as the PSD × Hz; levelDb = 10·log10(powerLinear).
 * Domain: a valid spectrum; thresholdDb finite; halfWidthBins an integer ≥ 1; maxTones ≥ 1.
 * Bad input: RangeError (TypeError for a malformed spectrum) starting with "detectTones".
 *
 * @example
 * detectTones(welchPsd(i, q, options));
 * // [{ frequencyHz: 1000.2, powerLinear: 0.25, levelDb: -6.02 }]
 */
export function detectTones(
  spectrum: PowerSpectrum,
  options: ToneDetectOptions = {},
): DetectedTone[] {
  const fn = 'detectTones';
  const s = requirePowerSpectrum(fn, spectrum);
  const psd = s.psd;
  const n = psd.length;
  const bw = s.binWidthHz;
  const h = options.halfWidthBins ?? 3;
  if (!Number.isInteger(h) || h < 1) {
    throw new RangeError(`${fn}: halfWidthBins must be an integer ≥ 1, got ${h}`);
  }
  const maxTones = options.maxTones ?? 32;
  if (!Number.isInteger(maxTones) || maxTones < 1) {
    throw new RangeError(`${fn}: maxTones must be an integer ≥ 1, got ${maxTones}`);
  }
  const threshold = requireFinite(fn, 'thresholdDb', options.thresholdDb ?? 10);
  const floor = options.floorPsd ?? medianOf(psd);
  if (!(floor >= 0) || !Number.isFinite(floor)) {
    throw new RangeError(`${fn}: floorPsd must be finite and ≥ 0, got ${floor}`);
  }
  const minSpacing = requireFinite(fn, 'minSpacingHz', options.minSpacingHz ?? (2 * h + 1) * bw);
  const f0 = s.frequencyHz[0];
  const fromHz = requireFinite(fn, 'fromHz', options.fromHz ?? f0);
  const toHz = requireFinite(fn, 'toHz', options.toHz ?? s.frequencyHz[n - 1]);
  const first = Math.max(0, Math.ceil((fromHz - f0) / bw - 1e-9));
  const last = Math.min(n - 1, Math.floor((toHz - f0) / bw + 1e-9));
  const level = floor * 10 ** (threshold / 10);
  const refine = options.refine ?? 'gaussian';

  const peaks: number[] = [];
  for (let k = first; k <= last; k++) {
    const v = psd[k];
    if (!(v > level) || (k > 0 && !(v > psd[k - 1]))) continue;
    let isMax = true;
    for (let j = Math.max(0, k - h); j <= Math.min(n - 1, k + h) && isMax; j++) isMax = psd[j] <= v;
    if (isMax) peaks.push(k);
  }
  peaks.sort((a, b) => psd[b] - psd[a]);

  const tones: DetectedTone[] = [];
  for (const k of peaks) {
    if (tones.length === maxTones) break;
    const offset =
      k > 0 && k < n - 1 ? peakOffsetBins(psd[k - 1], psd[k], psd[k + 1], refine) : 0;
    const frequencyHz = f0 + (k + offset) * bw;
    if (tones.some((t) => Math.abs(t.frequencyHz - frequencyHz) < minSpacing)) continue;
    const powerLinear = lobePower(s, k, h);
    tones.push({ frequencyHz, powerLinear, levelDb: 10 * Math.log10(powerLinear) });
  }
  return tones;
}

/** Median of the values (a sorted copy; the input is not changed). */
function medianOf(values: Float64Array): number {
  const sorted = Float64Array.from(values).sort();
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]);
}
