/**
 * A two-sided power spectral density on an ascending, uniform frequency grid: psd[k] is the
 * power per hertz (sample units² / Hz, e.g. full-scale² / Hz) at frequencyHz[k], and the bins
 * are binWidthHz apart. Σ psd[k]·binWidthHz over a band is the power in it.
 */
export interface PowerSpectrum {
  frequencyHz: Float64Array;
  psd: Float64Array;
  binWidthHz: number;
}

/**
 * Checks the shape of a {@link PowerSpectrum}: equal, non-zero lengths, a positive finite bin
 * width and a first frequency that is finite. Values are not scanned (callers in hot paths rely
 * on the producer). Throws a TypeError/RangeError whose message starts with `fnName`.
 */
export function requirePowerSpectrum(fnName: string, spectrum: PowerSpectrum): PowerSpectrum {
  if (
    spectrum === null ||
    typeof spectrum !== 'object' ||
    !(spectrum.frequencyHz instanceof Float64Array) ||
    !(spectrum.psd instanceof Float64Array)
  ) {
    throw new TypeError(`${fnName}: spectrum must hold Float64Array frequencyHz and psd`);
  }
  const n = spectrum.psd.length;
  if (n === 0 || spectrum.frequencyHz.length !== n) {
    throw new RangeError(`${fnName}: spectrum arrays must be non-empty and of equal length`);
  }
  if (!(spectrum.binWidthHz > 0) || !Number.isFinite(spectrum.binWidthHz)) {
    throw new RangeError(`${fnName}: spectrum.binWidthHz must be finite and > 0`);
  }
  if (!Number.isFinite(spectrum.frequencyHz[0])) {
    throw new RangeError(`${fnName}: spectrum.frequencyHz must be finite`);
  }
  return spectrum;
}

