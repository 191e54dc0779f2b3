import { createComplexNoise } from './gaussian-noise';
import { createMulberry32 } from './mulberry32';
import { createWelchAccumulator, welchPsd } from './welch';
import type { WindowName } from './window';

// Reference PSDs: scipy.signal.welch(x, fs=1000, window=w, nperseg=16, noverlap=v,
// detrend=False, return_onesided=False, scaling='density') with SciPy 1.17.1, fftshifted, for
// x[n] = cos(0.3n) + 0.25n/64 + j(0.5·sin(0.7n + 0.2) − 0.1), n = 0 … 63.
const SCIPY: { window: WindowName; overlap: number; psd: number[] }[] = [
  {
    window: 'hann',
    overlap: 0.5, // noverlap = 8
    psd: [
      8.9920512209111147e-10, 2.2943821758085876e-9, 1.0182772088615855e-8, 5.0895400216945568e-8,
      4.5859725816885665e-7, 7.718879582396774e-5, 1.0267980107765977e-3, 3.0602006110897707e-3,
      2.1265074800992955e-3, 2.4609629574293868e-3, 8.156049263475624e-4, 8.2223492317150807e-5,
      5.5205506056900932e-7, 6.1675807532215699e-8, 1.2349400348407354e-8, 2.8224353555282281e-9,
    ],
  },
  {
    window: 'flattop',
    overlap: 0.25, // noverlap = 4
    psd: [
      1.3474846399894072e-11, 1.3016389100018638e-11, 1.3465537590730519e-8, 4.6014652300909868e-6,
      1.0268988959648887e-4, 5.8863203715190803e-4, 1.4382750841656594e-3, 2.3533779252386034e-3,
      3.0888238609156405e-3, 2.6432574015749664e-3, 1.4598528769474389e-3, 4.8097035594910873e-4,
      8.2604660071665021e-5, 4.357307009501187e-6, 1.2888100256207394e-8, 1.3411235132074545e-11,
    ],
  },
  {
    window: 'blackmanharris',
    overlap: 0.5,
    psd: [
      3.5213632493536243e-13, 3.5348102112931092e-13, 4.0804154488385296e-13, 2.5333849871105199e-8,
      8.8233544424742823e-6, 2.0972262460235564e-4, 1.2671348773552718e-3, 2.5506533047830932e-3,
      2.2772912352556655e-3, 1.9354194693541136e-3, 9.1011297948171007e-4, 1.7020069079771725e-4,
      8.3873752389107473e-6, 2.5302219835472351e-8, 4.3155087211685527e-13, 3.5982658054680791e-13,
    ],
  },
];

function referenceSignal(): { i: Float64Array; q: Float64Array } {
  const i = new Float64Array(64);
  const q = new Float64Array(64);
  for (let n = 0; n < 64; n++) {
    i[n] = Math.cos(0.3 * n) + (0.25 * n) / 64;
    q[n] = 0.5 * Math.sin(0.7 * n + 0.2) - 0.1;
  }
  return { i, q };
}

describe('welchPsd', () => {
  it.each(SCIPY)('matches scipy.signal.welch ($window, overlap $overlap)', (reference) => {
    const { window, overlap, psd } = reference;
    const { i, q } = referenceSignal();
    const r = welchPsd(i, q, { sampleRateHz: 1000, segmentLength: 16, overlap, window });
    // Relative agreement to 1e-9 of the largest bin (the small bins are round-off dominated).
    psd.forEach((v, k) => expect(Math.abs(r.psd[k] - v)).toBeLessThan(1e-9 * 3.1e-3 + 1e-9 * v));
    const axis = Array.from({ length: 16 }, (_, k) => -500 + 62.5 * k);
    expect(Array.from(r.frequencyHz)).toEqual(axis);
    expect(r.binWidthHz).toBe(62.5);
  });

  it('averages the segments scipy does: (64 − 16)/8 + 1 = 7 at 50 % overlap', () => {
    const { i, q } = referenceSignal();
    const options = { sampleRateHz: 1000, segmentLength: 16 };
    expect(welchPsd(i, q, options).segmentsAveraged).toBe(7);
    expect(welchPsd(i, q, { ...options, overlap: 0 }).segmentsAveraged).toBe(4);
  });

  it('Parseval: ∫PSD df equals the mean power of stationary white noise within 2 %', () => {
    // Common practice identity. 2^16 samples of unit-power complex noise, N = 256: the estimate
    // of ∫PSD averages ~511 correlated segments, relative standard deviation ≈ 0.4 %; 2 % is 5σ.
    const n = 65536;
    const i = new Float64Array(n);
    const q = new Float64Array(n);
    createComplexNoise({ powerLinear: 1, seed: 11 }).addTo(i, q, 0, n);
    let mean = 0;
    for (let k = 0; k < n; k++) mean += (i[k] * i[k] + q[k] * q[k]) / n;
    const r = welchPsd(i, q, { sampleRateHz: 48000, segmentLength: 256 });
    const integral = r.psd.reduce((s, v) => s + v, 0) * r.binWidthHz;
    expect(integral / mean).toBeGreaterThan(0.98);
    expect(integral / mean).toBeLessThan(1.02);
  });

  it('Parseval holds exactly for a constant-envelope tone at any frequency (|x|² constant)', () => {
    // Σ_k |X_k|² = N·Σ|w·x|² = N·A²·Σw² for |x| = A, so ∫PSD df = A² for each window.
    for (const window of ['hann', 'flattop', 'blackmanharris'] as WindowName[]) {
      const i = new Float64Array(4096);
      const q = new Float64Array(4096);
      for (let n = 0; n < 4096; n++) {
        i[n] = 0.5 * Math.cos(0.1234 * n);
        q[n] = 0.5 * Math.sin(0.1234 * n);
      }
      const r = welchPsd(i, q, { sampleRateHz: 8000, segmentLength: 512, window });
      expect(r.psd.reduce((s, v) => s + v, 0) * r.binWidthHz).toBeCloseTo(0.25, 12);
    }
  });

  it('puts e^(−j2π·1000t) at −1000 Hz: the axis ascends from −fs/2', () => {
    const n = 2048;
    const i = new Float64Array(n);
    const q = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      i[k] = Math.cos((2 * Math.PI * 1000 * k) / 8000); // e^(−j2π·1000t): −1000 Hz
      q[k] = -Math.sin((2 * Math.PI * 1000 * k) / 8000);
    }
    const r = welchPsd(i, q, { sampleRateHz: 8000, segmentLength: 256 });
    const peak = r.psd.indexOf(Math.max(...r.psd));
    expect(r.frequencyHz[peak]).toBe(-1000);
  });

  it('reports the bin noise bandwidth: Hann 1.5 bins (Harris 1978)', () => {
    const { i, q } = referenceSignal();
    expect(welchPsd(i, q, { sampleRateHz: 1000, segmentLength: 16 }).enbwHz).toBeCloseTo(93.75, 10);
  });
});

describe('createWelchAccumulator', () => {
  it('gives the one-shot result whatever the chunking (carried partial segments)', () => {
    const n = 10000;
    const i = new Float32Array(n);
    const q = new Float32Array(n);
    createComplexNoise({ powerLinear: 0.1, seed: 3 }).addTo(i, q, 0, n);
    for (let k = 0; k < n; k++) i[k] += Math.cos(0.05 * k);
    for (const overlap of [0, 0.25, 0.5, 0.75, 0.9]) {
      const options = { sampleRateHz: 1000, segmentLength: 128, overlap };
      const whole = welchPsd(i, q, options);
      const acc = createWelchAccumulator(options);
      const next = createMulberry32(overlap * 100);
      for (let pos = 0; pos < n; ) {
        const len = Math.min(n - pos, Math.floor(next() * 300)); // includes empty chunks
        acc.push(i.subarray(pos, pos + len), q.subarray(pos, pos + len));
        pos += len;
      }
      const chunked = acc.result();
      expect(chunked.segmentsAveraged).toBe(whole.segmentsAveraged);
      chunked.psd.forEach((v, k) => expect(v).toBeCloseTo(whole.psd[k], 14));
      expect(acc.samplesPushed).toBe(n);
    }
  });

  it('tracks the mean and peak |x|² of the samples pushed', () => {
    const acc = createWelchAccumulator({ sampleRateHz: 1, segmentLength: 2 });
    expect([acc.meanPower, acc.peakPower]).toEqual([0, 0]);
    acc.push(Float64Array.of(1, 0, -2), Float64Array.of(0, 1, 0));
    expect([acc.meanPower, acc.peakPower]).toEqual([2, 4]); // (1 + 1 + 4)/3, max 4
  });

  it('can be read, then fed more, then read again', () => {
    const acc = createWelchAccumulator({ sampleRateHz: 1, segmentLength: 4, overlap: 0 });
    acc.push(Float64Array.of(1, 1, 1, 1), new Float64Array(4));
    expect(acc.result().segmentsAveraged).toBe(1);
    acc.push(Float64Array.of(1, 1, 1, 1), new Float64Array(4));
    expect(acc.result().segmentsAveraged).toBe(2);
  });

  it('rejects bad options, naming the function', () => {
    const ok = { sampleRateHz: 1000, segmentLength: 16 };
    for (const bad of [
      { ...ok, sampleRateHz: 0 },
      { ...ok, sampleRateHz: NaN },
      { ...ok, segmentLength: 24 },
      { ...ok, segmentLength: 1 },
      { ...ok, overlap: 1 },
      { ...ok, overlap: -0.1 },
      { ...ok, window: 'boxcar' as WindowName },
    ]) {
      expect(() => createWelchAccumulator(bad)).toThrow(/^createWelchAccumulator: /);
      const zeros = new Float64Array(16);
      expect(() => welchPsd(zeros, zeros, bad)).toThrow(/^welchPsd: /);
    }
  });

  it('rejects unequal lengths and non-finite samples (with their index), and early reads', () => {
    const acc = createWelchAccumulator({ sampleRateHz: 1000, segmentLength: 16 });
    expect(() => acc.result()).toThrow(/^WelchAccumulator\.result: no complete segment yet \(0 of/);
    expect(() => acc.push(new Float32Array(3), new Float32Array(4))).toThrow(
      /^WelchAccumulator\.push: i and q lengths differ/,
    );
    acc.push(new Float32Array(5), new Float32Array(5));
    for (const bad of [NaN, Infinity, -Infinity]) {
      const q = new Float32Array(40);
      q[30] = bad;
      const fresh = createWelchAccumulator({ sampleRateHz: 1, segmentLength: 16 });
      expect(() => fresh.push(new Float32Array(40), q)).toThrow(
        /^WelchAccumulator\.push: sample 30 is not finite/,
      );
    }
    const i = new Float32Array(4);
    i[2] = NaN;
    expect(() => acc.push(i, new Float32Array(4))).toThrow(/sample 7 is not finite/); // 5 + 2
    const short = new Float64Array(8);
    expect(() => welchPsd(short, short, { sampleRateHz: 1, segmentLength: 16 })).toThrow(
      /^welchPsd: no complete segment/,
    );
  });
});
