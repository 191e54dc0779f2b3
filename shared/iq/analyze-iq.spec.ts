import { complexFftOfSize } from '../dsp/fft';
import { createMulberry32 } from '../dsp/mulberry32';
import type { SsbSignalSpec, SsbTruth } from '../dsp/ssb-signal-spec';
import { createSsbSignalStream, synthesizeSsb } from '../dsp/synthesizer';
import { imageRejectionDb } from '../phasing/image-rejection';
import { meanPowerFromEnvelope, pepFromEnvelope } from '../power/envelope-power';
import { analyzeIq, createIqAnalyzer } from './analyze-iq';

const db = (p: number): number => 10 * Math.log10(p);
/** The synthesizer's truth for "dB below PEP": against the sampled noiseless crest. */
const belowCrestDb = (truth: SsbTruth, powerLinear: number): number =>
  db(truth.pepLinear / powerLinear);
/** |actual − expected| < 0.3 dB: the round-trip tolerance this analysis promises. */
function expectWithin03(actual: number | null, expected: number): void {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected)).toBeLessThan(0.3);
}
const fs = 48000;
const twoTone: SsbSignalSpec = {
  sampleRateHz: fs,
  sampleCount: 96000,
  sideband: 'usb',
  tones: [
    { audioHz: 1100, levelDbfs: -10 },
    { audioHz: 1700, levelDbfs: -10 },
  ],
  noise: { powerDbfs: -90, seed: 1 },
};
const oneTone: SsbSignalSpec = { ...twoTone, tones: [{ audioHz: 1000, levelDbfs: -6 }] };

function analyze(spec: SsbSignalSpec, options: { fullScaleDbm?: number } = {}) {
  const s = synthesizeSsb(spec);
  const result = analyzeIq(s.i, s.q, { sampleRateHz: spec.sampleRateHz, ...options });
  return { truth: s.truth, result };
}

describe('analyzeIq: synthesizer round trip', () => {
  it('two equal tones: PEP = tone + 6.02 dB, mean = tone + 3.01 dB (n²·P, n·P: published)', () => {
    // Check values (common practice arithmetic): two −10 dB tones → PEP −3.98, mean −6.99.
    const { result } = analyze(twoTone, { fullScaleDbm: 50 });
    expect(result.pepDbfs).toBeCloseTo(-3.98, 2);
    expect(result.meanPowerDbfs).toBeCloseTo(-6.99, 2);
    expect(result.pepDbm).toBeCloseTo(46.02, 2);
    expect(result.meanPowerDbm).toBeCloseTo(43.01, 2);
    expect(result.tones.filter((t) => t.levelDbfs > -20)).toEqual([
      { frequencyHz: expect.closeTo(1100, 0), levelDbfs: expect.closeTo(-10, 1) },
      { frequencyHz: expect.closeTo(1700, 0), levelDbfs: expect.closeTo(-10, 1) },
    ]);
    expect(result.sideband).toBe('usb');
  });

  it('PEP and mean agree with the power module (max and mean of |x|²): two paths', () => {
    const s = synthesizeSsb({ ...twoTone, carrierLeakBelowPepDb: 35 });
    const result = analyzeIq(s.i, s.q, { sampleRateHz: fs });
    expect(result.pepDbfs).toBeCloseTo(db(pepFromEnvelope(s.i, s.q)), 12);
    expect(result.meanPowerDbfs).toBeCloseTo(db(meanPowerFromEnvelope(s.i, s.q)), 12);
  });

  it('1° phase error alone → 41.18 dB unwanted-sideband suppression (common practice)', () => {
    const { result } = analyze({ ...oneTone, phaseErrorDeg: 1 });
    expectWithin03(result.unwantedSidebandSuppressionDb, 41.18);
  });

  it.each([
    [0.1, 0],
    [0.1, 1],
    [0.5, 2],
    [-0.3, -1.5],
  ])('imbalance %f dB, phase %f°: the published image-rejection relation', (imbalance, phase) => {
    // Expected from the phasing module's imageRejectionDb, a separate implementation of
    // IRR = (1 + 2g·cos φ + g²)/(1 − 2g·cos φ + g²). The tone sits off-bin on purpose.
    const errors = { amplitudeImbalanceDb: imbalance, phaseErrorDeg: phase };
    const tones = [{ audioHz: 1234.5, levelDbfs: -3 }];
    const { result } = analyze({ ...oneTone, tones, ...errors });
    expectWithin03(result.unwantedSidebandSuppressionDb, imageRejectionDb(errors));
  });

  it('carrier leak comes back within 0.3 dB, below the sampled PEP', () => {
    for (const leakDb of [30, 45, 60]) {
      const { truth, result } = analyze({ ...twoTone, carrierLeakBelowPepDb: leakDb });
      expectWithin03(result.carrierSuppressionDb, belowCrestDb(truth, truth.carrierPowerLinear));
      expectWithin03(result.carrierSuppressionDb, leakDb); // the crest ≈ the nominal PEP here
    }
  });

  it('IMD3 and IMD5 come back as the stronger product of each order, dB below PEP', () => {
    const { truth, result } = analyze({
      ...twoTone,
      carrierLeakBelowPepDb: 50,
      intermod: [
        { order: 3, belowPepDb: 30 },
        { order: 5, belowPepDb: 48, side: 'lower' }, // at −100 Hz, across the carrier
        { order: 5, belowPepDb: 42, side: 'upper' },
      ],
    });
    // The products raise the crest: compare with the sampled noiseless crest.
    const [im3] = truth.intermodProducts;
    const im5Upper = truth.intermodProducts[3];
    expectWithin03(result.imd3Db, belowCrestDb(truth, im3.powerLinear));
    expectWithin03(result.imd5Db, belowCrestDb(truth, im5Upper.powerLinear));
    expect(Math.abs(result.pepDbfs - db(truth.pepLinear))).toBeLessThan(0.01);
  });

  it('LSB: auto finds the lower sideband and reads the image above the carrier', () => {
    const spec: SsbSignalSpec = {
      ...oneTone,
      sideband: 'lsb',
      phaseErrorDeg: 2,
      carrierLeakBelowPepDb: 40,
    };
    const { truth, result } = analyze(spec);
    expect(result.sideband).toBe('lsb');
    expectWithin03(result.unwantedSidebandSuppressionDb, 35.16); // 2° alone (common practice)
    expectWithin03(result.carrierSuppressionDb, belowCrestDb(truth, truth.carrierPowerLinear));
    // Forcing the wrong sideband makes the image the "wanted" tone: the suppression goes negative.
    const s = synthesizeSsb(spec);
    const wrong = analyzeIq(s.i, s.q, { sampleRateHz: fs, sideband: 'usb' });
    expect(wrong.unwantedSidebandSuppressionDb).toBeLessThan(-30);
  });

  it('IMD is null without a two-tone test (one tone, or a second tone 10 dB down)', () => {
    expect(analyze(oneTone).result.imd3Db).toBeNull();
    const tones = [
      { audioHz: 1100, levelDbfs: -10 },
      { audioHz: 1700, levelDbfs: -20 },
    ];
    const unequal = analyze({ ...twoTone, tones });
    expect([unequal.result.imd3Db, unequal.result.imd5Db]).toEqual([null, null]);
  });

  it('occupied bandwidth of a flat 300–2700 Hz band is 2376 Hz (RR 1.153; common practice)', () => {
    // 99 % of a flat 2400 Hz band = 0.99 × 2400 Hz.
    // Flat-magnitude, random-phase spectrum on exact FFT bins, inverse-transformed to a periodic
    // capture; the PSD then is flat across the band to within the Welch scatter.
    const n = 65536;
    const spectrum = new Float64Array(2 * n);
    const next = createMulberry32(77);
    for (let k = 0; k < n; k++) {
      const f = (k * fs) / n;
      if (f >= 300 && f <= 2700) {
        const phase = 2 * Math.PI * next();
        spectrum[2 * k] = Math.cos(phase);
        spectrum[2 * k + 1] = Math.sin(phase);
      }
    }
    const x = new Float64Array(2 * n);
    complexFftOfSize(n).inverse(spectrum, x);
    const i = Float32Array.from({ length: n }, (_, k) => x[2 * k] * 50);
    const q = Float32Array.from({ length: n }, (_, k) => x[2 * k + 1] * 50);
    const result = analyzeIq(i, q, { sampleRateHz: fs });
    // Tolerance: the band edges are smeared by the Hann lobe (±2 bins of 11.7 Hz).
    expect(Math.abs(result.occupiedBandwidthHz - 2376)).toBeLessThan(15);
  });

  it('its PSD integrates to the mean power (Parseval, common practice), from −fs/2 up', () => {
    const { result } = analyze({ ...twoTone, carrierLeakBelowPepDb: 40 });
    const { frequencyHz, psdDbfsPerHz } = result.psd;
    expect(frequencyHz[0]).toBe(-fs / 2);
    expect(frequencyHz.length).toBe(4096);
    const binWidthHz = frequencyHz[1] - frequencyHz[0];
    const integral = psdDbfsPerHz.reduce((s, v) => s + 10 ** (v / 10), 0) * binWidthHz;
    expect(Math.abs(db(integral) - result.meanPowerDbfs)).toBeLessThan(0.05);
  });

  it('streaming gives the one-shot answer whatever the chunks', () => {
    const spec: SsbSignalSpec = {
      ...twoTone,
      carrierLeakBelowPepDb: 45,
      intermod: [{ order: 3, belowPepDb: 33 }],
    };
    const s = synthesizeSsb(spec);
    const whole = analyzeIq(s.i, s.q, { sampleRateHz: fs });
    const analyzer = createIqAnalyzer({ sampleRateHz: fs });
    for (let pos = 0, len = 1; pos < s.i.length; pos += len, len = (len * 7) % 5003) {
      analyzer.push(s.i.subarray(pos, pos + len), s.q.subarray(pos, pos + len));
    }
    const chunked = analyzer.finish();
    expect(chunked.sampleCount).toBe(96000);
    const keys = [
      'pepDbfs',
      'meanPowerDbfs',
      'carrierSuppressionDb',
      'unwantedSidebandSuppressionDb',
      'imd3Db',
      'occupiedBandwidthHz',
    ] as const;
    for (const key of keys) expect(chunked[key]).toBeCloseTo(whole[key] as number, 9);
  });

  it('a 10 s × 192 kS/s capture streams through in bounded memory and reads right', () => {
    const spec: SsbSignalSpec = {
      sampleRateHz: 192000,
      sampleCount: 1_920_000,
      sideband: 'usb',
      tones: [
        { audioHz: 400, levelDbfs: -9 },
        { audioHz: 1800, levelDbfs: -9 }, // 47 CFR 2.1049 tones for a 3.0 kHz bandwidth
      ],
      phaseErrorDeg: 1,
      carrierLeakBelowPepDb: 42,
      intermod: [{ order: 3, belowPepDb: 32 }],
    };
    const stream = createSsbSignalStream(spec);
    const analyzer = createIqAnalyzer({ sampleRateHz: 192000 });
    for (let c = stream.next(); c !== null; c = stream.next()) analyzer.push(c.i, c.q);
    const result = analyzer.finish();
    const truth = stream.truth();
    expect(result.psd.frequencyHz.length).toBe(16384);
    expectWithin03(result.unwantedSidebandSuppressionDb, 41.18);
    expectWithin03(result.carrierSuppressionDb, belowCrestDb(truth, truth.carrierPowerLinear));
    expectWithin03(result.imd3Db, belowCrestDb(truth, truth.intermodProducts[0].powerLinear));
  });
});

describe('analyzeIq: edge cases and errors', () => {
  it('analyses a capture shorter than one segment with a shorter segment', () => {
    const s = synthesizeSsb({ ...oneTone, sampleCount: 1000 });
    const result = analyzeIq(s.i, s.q, { sampleRateHz: fs });
    expect(result.psd.frequencyHz.length).toBe(512);
    expect(result.pepDbfs).toBeCloseTo(-6, 2); // −90 dBFS noise rides on the crest
    expect(result.tones.some((t) => Math.abs(t.frequencyHz - 1000) < 50)).toBe(true);
  });

  it('rejects too few samples (empty, one), all-zero captures, NaN, unequal lengths', () => {
    const run = (i: Float32Array, q: Float32Array) => () => analyzeIq(i, q, { sampleRateHz: fs });
    const zeros = (n: number): Float32Array => new Float32Array(n);
    expect(run(zeros(0), zeros(0))).toThrow(/^analyzeIq: at least 16 samples are needed, got 0/);
    expect(run(Float32Array.of(1), Float32Array.of(0))).toThrow(/^analyzeIq: at least 16/);
    expect(run(zeros(64), zeros(64))).toThrow(/^analyzeIq: the capture holds no signal/);
    const q = new Float32Array(64).fill(0.1);
    q[40] = NaN;
    expect(run(zeros(64), q)).toThrow(/^analyzeIq: sample 40 is not finite/);
    expect(run(zeros(3), zeros(4))).toThrow(/^analyzeIq: i and q lengths differ/);
  });

  it('streaming: errors name the step, a rejected push spoils the run, finish repeats', () => {
    const analyzer = createIqAnalyzer({ sampleRateHz: fs, segmentLength: 16 });
    const zeros = (n: number): Float32Array => new Float32Array(n);
    expect(() => analyzer.finish()).toThrow(/^IqAnalyzer\.finish: at least 16 samples/);
    const bad = zeros(8);
    bad[3] = Infinity;
    expect(() => analyzer.push(bad, zeros(8))).toThrow(/^IqAnalyzer\.push: sample 3 is not finite/);
    expect(() => analyzer.push(zeros(8), zeros(8))).toThrow(/^IqAnalyzer\.push: an earlier push/);
    expect(() => analyzer.finish()).toThrow(/^IqAnalyzer\.finish: an earlier push/);
    const ok = createIqAnalyzer({ sampleRateHz: fs, segmentLength: 16 });
    ok.push(new Float32Array(32).fill(0.5), zeros(32));
    expect(ok.finish()).toBe(ok.finish());
    expect(() => ok.push(zeros(1), zeros(1))).toThrow(/^IqAnalyzer\.push: the analysis is already/);
  });

  it('rejects bad options, naming the function', () => {
    for (const bad of [
      { sampleRateHz: 0 },
      { sampleRateHz: fs, sideband: 'dsb' as 'usb' },
      { sampleRateHz: fs, fullScaleDbm: NaN },
      { sampleRateHz: fs, segmentLength: 8 },
      { sampleRateHz: fs, segmentLength: 1000 },
    ]) {
      expect(() => createIqAnalyzer(bad)).toThrow(/^createIqAnalyzer: /);
    }
  });
});
