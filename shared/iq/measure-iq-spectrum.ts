import { occupiedBandwidthFromPowers } from '../bandwidth/occupied-bandwidth';
import { lobePower, tonePowerAt } from '../dsp/band-power';
import type { PowerSpectrum } from '../dsp/power-spectrum';
import { detectTones, type DetectedTone } from '../dsp/tone-detect';
import { intermodProductFrequencies } from '../measurements/intermod-product-frequencies';

/** Main-lobe half width used for every line reading, bins (Hann's lobe is ±2 bins). */
export const LOBE_HALF_WIDTH_BINS = 3;
/** A detected line must stand this far above the median PSD, dB (common practice). */
export const TONE_THRESHOLD_DB = 10;
/**
 * The second tone makes a two-tone test when within this many dB of the first (47 CFR 2.1049
 * asks for equal tones; the slack is common practice).
 */
export const TWO_TONE_MATCH_DB = 6;

/** Spectral readings of a capture, linear powers in full-scale² (analyzeIq gives the dB forms). */
export interface IqSpectralReadings {
  sideband: 'usb' | 'lsb';
  carrierPowerLinear: number;
  /** Strongest wanted tone and its mirror image, or null without a wanted tone. */
  wanted: { tone: DetectedTone; imagePowerLinear: number } | null;
  /** Stronger product of each order, or null when there is no two-tone test or no clear product. */
  imd3PowerLinear: number | null;
  imd5PowerLinear: number | null;
  occupiedBandwidthHz: number;
  tones: DetectedTone[];
}

/**
 * Reads a capture's Welch PSD (carrier at 0 Hz): the sideband ('auto' = the half with more power
 * outside the carrier lobe), the residual carrier (the 0 Hz main lobe), the strongest wanted tone
 * and the power at its mirror frequency, the two-tone intermodulation products at f1 − kΔ and
 * f2 + kΔ (k = 1, 2) of the two strongest wanted tones, the 99 % occupied bandwidth and the list
 * of detected lines. Every line power is a main-lobe integral (no scalloping error). A product
 * whose lobe would overlap the carrier, a tone or an image is not read.
 * Source: single-tone image method, two-tone IMD method, RR 1.153 occupied bandwidth (see the
 * measurement functions); internal to analyzeIq, which validates its input.
 */
export function measureIqSpectrum(
  spectrum: PowerSpectrum,
  sidebandOption: 'usb' | 'lsb' | 'auto',
): IqSpectralReadings {
  const bw = spectrum.binWidthHz;
  const h = LOBE_HALF_WIDTH_BINS;
  const clearHz = (2 * h + 1) * bw; // a line this far from another has a separate lobe
  const sideband =
    sidebandOption === 'auto' ? louderHalf(spectrum, (h + 0.5) * bw) : sidebandOption;
  const sign = sideband === 'usb' ? 1 : -1;
  const tones = detectTones(spectrum, { thresholdDb: TONE_THRESHOLD_DB, halfWidthBins: h });
  const wantedTones = tones.filter((t) => sign * t.frequencyHz >= clearHz); // strongest first
  const carrierPowerLinear = tonePowerAt(spectrum, 0, h);
  const binPowers = spectrum.psd.map((p) => p * bw);
  const occupied = occupiedBandwidthFromPowers(spectrum.frequencyHz, binPowers);

  let wanted: IqSpectralReadings['wanted'] = null;
  if (wantedTones.length > 0) {
    const tone = wantedTones[0];
    wanted = { tone, imagePowerLinear: mirrorLobePower(spectrum, tone.frequencyHz, h) };
  }
  let imd3PowerLinear: number | null = null;
  let imd5PowerLinear: number | null = null;
  const twoTone =
    wantedTones.length >= 2 && wantedTones[0].levelDb - wantedTones[1].levelDb <= TWO_TONE_MATCH_DB;
  if (twoTone) {
    const a = sign * wantedTones[0].frequencyHz;
    const b = sign * wantedTones[1].frequencyHz;
    const occupiedLines = [0, a, b, -a, -b].map((f) => sign * f);
    const productPower = (order: 3 | 5): number | null => {
      const { lowerHz, upperHz } = intermodProductFrequencies({ tone1Hz: a, tone2Hz: b, order });
      const readable = [lowerHz, upperHz]
        .map((audioHz) => sign * audioHz)
        .filter((f) => Math.abs(f) < spectrum.frequencyHz[spectrum.psd.length - 1] - h * bw)
        .filter((f) => occupiedLines.every((line) => Math.abs(f - line) >= clearHz));
      if (readable.length === 0) return null;
      return Math.max(...readable.map((f) => tonePowerAt(spectrum, f, h)));
    };
    imd3PowerLinear = productPower(3);
    imd5PowerLinear = productPower(5);
  }
  return {
    sideband,
    carrierPowerLinear,
    wanted,
    imd3PowerLinear,
    imd5PowerLinear,
    occupiedBandwidthHz: occupied.bandwidthHz,
    tones: [...tones].sort((x, y) => x.frequencyHz - y.frequencyHz),
  };
}

/** 'usb' when the bins above +guardHz carry at least as much power as those below −guardHz. */
function louderHalf(spectrum: PowerSpectrum, guardHz: number): 'usb' | 'lsb' {
  let upper = 0;
  let lower = 0;
  for (let k = 0; k < spectrum.psd.length; k++) {
    const f = spectrum.frequencyHz[k];
    if (f > guardHz) upper += spectrum.psd[k];
    else if (f < -guardHz) lower += spectrum.psd[k];
  }
  return upper >= lower ? 'usb' : 'lsb';
}

/** Lobe power at the mirror (−f) of a line: bin N − m mirrors bin m on the fftshifted grid. */
function mirrorLobePower(spectrum: PowerSpectrum, frequencyHz: number, h: number): number {
  const n = spectrum.psd.length;
  const m = Math.round((frequencyHz - spectrum.frequencyHz[0]) / spectrum.binWidthHz);
  return lobePower(spectrum, n - m, h);
}
