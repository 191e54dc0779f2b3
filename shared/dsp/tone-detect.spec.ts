import { createComplexNoise } from './gaussian-noise';
import { detectTones, type ToneDetectOptions } from './tone-detect';
import { welchPsd } from './welch';

const fs = 8000;
const n = 65536;

/** Complex tones (Hz, amplitude) plus seeded noise of the given total power. */
function signal(tones: [number, number][], noisePower: number) {
  const i = new Float64Array(n);
  const q = new Float64Array(n);
  for (const [f, a] of tones) {
    for (let k = 0; k < n; k++) {
      i[k] += a * Math.cos((2 * Math.PI * f * k) / fs);
      q[k] += a * Math.sin((2 * Math.PI * f * k) / fs);
    }
  }
  createComplexNoise({ powerLinear: noisePower, seed: 9 }).addTo(i, q, 0, n);
  return { i, q };
}

describe('detectTones', () => {
  // 1024-point segments at 8 kHz: 7.8125 Hz bins. Tones placed off-bin on purpose.
  const { i, q } = signal([[1003.1, 0.5], [-1702.9, 0.1], [2500.4, 0.01]], 1e-6);
  const psd = welchPsd(i, q, { sampleRateHz: fs, segmentLength: 1024 });

  it('finds every tone, strongest first, with its true power (main-lobe integral)', () => {
    const tones = detectTones(psd);
    expect(tones).toHaveLength(3);
    // Powers a² = 0.25, 0.01, 1e-4; noise in 7 bins adds ≈ 1e-6·7/1024 — negligible.
    expect(tones.map((t) => t.levelDb)).toEqual([
      expect.closeTo(10 * Math.log10(0.25), 2),
      expect.closeTo(-20, 2),
      expect.closeTo(-40, 1),
    ]);
    expect(tones[0].powerLinear).toBeCloseTo(0.25, 3);
  });

  it('refines the frequency to a small fraction of a bin (Gaussian interpolation)', () => {
    const tones = detectTones(psd);
    // Hann bias of the log-parabola vertex is a few hundredths of a bin: allow 0.05 bin.
    expect(Math.abs(tones[0].frequencyHz - 1003.1)).toBeLessThan(0.05 * 7.8125);
    expect(Math.abs(tones[1].frequencyHz + 1702.9)).toBeLessThan(0.05 * 7.8125);
    const coarse = detectTones(psd, { refine: 'none' });
    const binOf = (f: number): number => (f + 4000) / 7.8125;
    expect(binOf(coarse[0].frequencyHz)).toBeCloseTo(Math.round(binOf(1003.1)), 10);
  });

  it('honours the threshold, the search range, maxTones and the minimum spacing', () => {
    const found = (options: ToneDetectOptions): number[] =>
      detectTones(psd, options).map((t) => Math.round(t.frequencyHz));
    expect(found({ thresholdDb: 300 })).toEqual([]);
    expect(found({ maxTones: 1 })).toEqual([1003]);
    expect(found({ fromHz: 0 })).toEqual([1003, 2500]);
    expect(found({ minSpacingHz: 3000 })).toEqual([1003]);
    expect(found({ floorPsd: 1e-4, thresholdDb: 0 })).toHaveLength(2); // peak PSD ≈ P/ENBW
  });

  it('keeps two tones 10 bins apart separate', () => {
    const close = signal([[1000, 0.5], [1078.125, 0.5]], 1e-8);
    const closePsd = welchPsd(close.i, close.q, { sampleRateHz: fs, segmentLength: 1024 });
    const tones = detectTones(closePsd);
    expect(tones).toHaveLength(2);
    tones.forEach((t) => expect(t.powerLinear).toBeCloseTo(0.25, 3));
  });

  it('finds nothing in pure noise at a 10 dB threshold with many averages', () => {
    const noise = signal([], 1);
    const noisePsd = welchPsd(noise.i, noise.q, { sampleRateHz: fs, segmentLength: 256 });
    expect(detectTones(noisePsd)).toEqual([]);
  });

  it('rejects bad options, naming the function', () => {
    expect(() => detectTones(psd, { halfWidthBins: 0 })).toThrow(/^detectTones: halfWidthBins/);
    expect(() => detectTones(psd, { maxTones: 0 })).toThrow(/^detectTones: maxTones/);
    expect(() => detectTones(psd, { thresholdDb: NaN })).toThrow(/^detectTones: thresholdDb/);
    expect(() => detectTones(psd, { floorPsd: -1 })).toThrow(/^detectTones: floorPsd/);
    expect(() => detectTones(psd, { fromHz: NaN })).toThrow(/^detectTones: fromHz/);
  });
});
