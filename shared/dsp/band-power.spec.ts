import { bandPower, tonePowerAt } from './band-power';
import { createComplexNoise } from './gaussian-noise';
import type { PowerSpectrum } from './power-spectrum';
import { welchPsd } from './welch';

function tone(n: number, cyclesPerSample: number, amplitude: number) {
  const i = new Float64Array(n);
  const q = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    i[k] = amplitude * Math.cos(2 * Math.PI * cyclesPerSample * k);
    q[k] = amplitude * Math.sin(2 * Math.PI * cyclesPerSample * k);
  }
  return { i, q };
}

describe('bandPower', () => {
  const small: PowerSpectrum = {
    frequencyHz: Float64Array.of(0, 1, 2),
    psd: Float64Array.of(1, 2, 3),
    binWidthHz: 1,
  };

  it('sums the bins whose centres lie in the band, ends included (rectangle rule)', () => {
    expect(bandPower(small, 1, 2)).toBe(5);
    expect(bandPower(small, -10, 10)).toBe(6);
    expect(bandPower(small, 0.4, 0.6)).toBe(0);
  });

  it('reads white noise as density × bandwidth (noise scales with bandwidth, published)', () => {
    // Unit-power complex noise at fs = 48 kHz has a flat density 1/48000 per Hz; a 4 kHz band
    // holds 4000/48000 of it. 2^17 samples, N = 512: ±3 % covers the estimate's scatter (>5σ).
    const n = 131072;
    const i = new Float64Array(n);
    const q = new Float64Array(n);
    createComplexNoise({ powerLinear: 1, seed: 5 }).addTo(i, q, 0, n);
    const psd = welchPsd(i, q, { sampleRateHz: 48000, segmentLength: 512 });
    const band = bandPower(psd, 1000, 5000 - psd.binWidthHz / 2);
    expect(band / (4000 / 48000)).toBeGreaterThan(0.97);
    expect(band / (4000 / 48000)).toBeLessThan(1.03);
  });

  it('rejects reversed or non-finite limits and malformed spectra', () => {
    expect(() => bandPower(small, 2, 1)).toThrow(/^bandPower: fromHz \(2\) must not exceed toHz/);
    expect(() => bandPower(small, NaN, 1)).toThrow(/^bandPower: fromHz must be finite/);
    const zeroWidth = { ...small, binWidthHz: 0 };
    expect(() => bandPower(zeroWidth, 0, 1)).toThrow(/^bandPower: spectrum.binWidthHz/);
    const short = { ...small, psd: new Float64Array(2) };
    expect(() => bandPower(short, 0, 1)).toThrow(/^bandPower: spectrum arrays/);
    expect(() => bandPower(null as unknown as PowerSpectrum, 0, 1)).toThrow(TypeError);
  });
});

describe('tonePowerAt', () => {
  const fs = 8192;
  const n = 65536;
  const segmentLength = 1024; // 8 Hz bins

  it.each([0, 0.125, 0.25, 0.375, 0.5])(
    'reads a −6.02 dBFS tone within 0.01 dB wherever it falls in the bin (offset %f bin)',
    (offsetBins) => {
      // Main-lobe integration removes scalloping (common practice); amplitude 0.5 → power 0.25.
      const { i, q } = tone(n, (1000 + offsetBins * 8) / fs, 0.5);
      const psd = welchPsd(i, q, { sampleRateHz: fs, segmentLength });
      const power = tonePowerAt(psd, 1000 + offsetBins * 8);
      expect(10 * Math.log10(power / 0.25)).toBeCloseTo(0, 2);
    },
  );

  it('whereas the peak bin alone reads 1.42 dB low at half a bin (Hann, Harris 1978)', () => {
    const peakBinPsd = (frequencyHz: number): number => {
      const { i, q } = tone(n, frequencyHz / fs, 0.5);
      return Math.max(...welchPsd(i, q, { sampleRateHz: fs, segmentLength }).psd);
    };
    expect(10 * Math.log10(peakBinPsd(1004) / peakBinPsd(1000))).toBeCloseTo(-1.42, 2);
  });

  it('rejects frequencies off the grid and bad lobe widths', () => {
    const zeros = new Float64Array(64);
    const psd = welchPsd(zeros, zeros, { sampleRateHz: 64, segmentLength: 16 });
    expect(() => tonePowerAt(psd, 40)).toThrow(/^tonePowerAt: 40 Hz lies outside the spectrum/);
    expect(() => tonePowerAt(psd, 0, -1)).toThrow(/^tonePowerAt: halfWidthBins/);
    expect(() => tonePowerAt(psd, 0, 1.5)).toThrow(/^tonePowerAt: halfWidthBins/);
    expect(() => tonePowerAt(psd, Infinity)).toThrow(/^tonePowerAt: frequencyHz must be finite/);
    expect(tonePowerAt(psd, 0, 0)).toBe(0);
  });
});
