import { requireFinite } from '../units/number-guards';
import { requirePowerSpectrum, type PowerSpectrum } from './power-spectrum';

/**
 * Power in a band of a PSD: the sum of psd[k]·binWidthHz over the bins whose centres lie in
 * [fromHz, toHz] (both ends included). Summed in linear units; exact for noise-like signals
 * when the band spans many bins, and for a tone when the band holds its whole main lobe.
 *
 * Source: band power from a PSD, P = ∫ S(f) df (IEEE Std 1057 / common practice); the bin sum
 * is the rectangle rule on the uniform Welch grid.
 * Units: Hz in; power in the PSD's units × Hz (e.g. full-scale² for a dBFS capture).
 * Domain: finite fromHz ≤ toHz; a band that holds no bin centre gives 0.
 * Bad input: RangeError (TypeError for a malformed spectrum) starting with "bandPower".
 *
 * @example
 * const psd = Float64Array.of(1, 2, 3);
 * bandPower({ frequencyHz: Float64Array.of(0, 1, 2), psd, binWidthHz: 1 }, 1, 2); // 5
 */
export function bandPower(spectrum: PowerSpectrum, fromHz: number, toHz: number): number {
  const fn = 'bandPower';
  const s = requirePowerSpectrum(fn, spectrum);
  const lo = requireFinite(fn, 'fromHz', fromHz);
  const hi = requireFinite(fn, 'toHz', toHz);
  if (lo > hi) throw new RangeError(`${fn}: fromHz (${lo}) must not exceed toHz (${hi})`);
  const f0 = s.frequencyHz[0];
  const bw = s.binWidthHz;
  // A relative slack of 1e-9 bin keeps a band edge that falls exactly on a bin centre inside.
  const first = Math.max(0, Math.ceil((lo - f0) / bw - 1e-9));
  const last = Math.min(s.psd.length - 1, Math.floor((hi - f0) / bw + 1e-9));
  let sum = 0;
  for (let k = first; k <= last; k++) sum += s.psd[k];
  return sum * bw;
}

/**
 * Power of a tone (or of the residual carrier) at a known frequency: the PSD integrated over
 * its main lobe, i.e. the bins within ±halfWidthBins of the bin nearest frequencyHz, times the
 * bin width. Because the Welch PSD is normalized by Σw², this total does not depend on where the
 * tone falls within a bin (no scalloping loss), provided the lobe fits: Hann's main lobe is
 * ±2 bins, so the default ±3 keeps ≥ 99.99 % of the tone's power (−0.0003 dB at half a bin).
 *
 * Source: Parseval's relation for the windowed DFT (common practice: "integrate a few bins
 * around a tone"). Units: Hz in; power as {@link bandPower}.
 * Domain: frequencyHz finite and within half a bin of the grid; halfWidthBins an integer ≥ 0;
 * bins beyond the grid edges are skipped. Noise inside the lobe is included (no subtraction).
 * Bad input: RangeError (TypeError for a malformed spectrum) starting with "tonePowerAt".
 *
 * @example tonePowerAt(welch, 1000); // ≈ 0.5 for 0.707·e^(j2π·1000t)
 */
export function tonePowerAt(
  spectrum: PowerSpectrum,
  frequencyHz: number,
  halfWidthBins = 3,
): number {
  const fn = 'tonePowerAt';
  const s = requirePowerSpectrum(fn, spectrum);
  const f = requireFinite(fn, 'frequencyHz', frequencyHz);
  if (!Number.isInteger(halfWidthBins) || halfWidthBins < 0) {
    throw new RangeError(`${fn}: halfWidthBins must be an integer ≥ 0, got ${halfWidthBins}`);
  }
  const centre = Math.round((f - s.frequencyHz[0]) / s.binWidthHz);
  if (centre < 0 || centre >= s.psd.length) {
    throw new RangeError(`${fn}: ${f} Hz lies outside the spectrum`);
  }
  return lobePower(s, centre, halfWidthBins);
}

/** Σ psd over bins centre ± halfWidth (clipped to the grid) × bin width. No checks: internal. */
export function lobePower(spectrum: PowerSpectrum, centre: number, halfWidth: number): number {
  const first = Math.max(0, centre - halfWidth);
  const last = Math.min(spectrum.psd.length - 1, centre + halfWidth);
  let sum = 0;
  for (let k = first; k <= last; k++) sum += spectrum.psd[k];
  return sum * spectrum.binWidthHz;
}
