import { imageRejectionDb } from '../phasing/image-rejection';
import type { SsbSignalSpec } from './ssb-signal-spec';
import { createSsbSignalStream, synthesizeSsb } from './synthesizer';

const base: SsbSignalSpec = {
  sampleRateHz: 48000,
  sampleCount: 4800,
  sideband: 'usb',
  tones: [{ audioHz: 1000, levelDbfs: -6 }],
};
const db = (p: number): number => 10 * Math.log10(p);

describe('synthesizeSsb', () => {
  it('an ideal USB modulator gives A·e^(+jωt) sample by sample (phasing method, no image)', () => {
    const { i, q, truth } = synthesizeSsb(base);
    const a = Math.sqrt(10 ** (-6 / 10));
    for (let n = 0; n < base.sampleCount; n += 37) {
      const angle = (2 * Math.PI * 1000 * n) / 48000;
      expect(i[n]).toBeCloseTo(a * Math.cos(angle), 6); // float32 output
      expect(q[n]).toBeCloseTo(a * Math.sin(angle), 6);
    }
    expect(truth.imageRejectionDb).toBe(Infinity);
    expect(db(truth.pepLinear)).toBeCloseTo(-6, 6);
  });

  it('LSB puts the tone at −f: q is the negated USB q', () => {
    const usb = synthesizeSsb(base);
    const lsb = synthesizeSsb({ ...base, sideband: 'lsb' });
    expect(Array.from(lsb.i)).toEqual(Array.from(usb.i));
    expect(Array.from(lsb.q)).toEqual(Array.from(usb.q).map((v) => 0 - v));
    expect(lsb.truth.wantedTones[0].frequencyHz).toBe(-1000);
  });

  it.each([
    // Worked values of the phasing relation (common practice): see the image-rejection module.
    [0, 1, 41.18],
    [0, 2, 35.16],
    [0.1, 0, 44.8],
    [0.1, 1, 39.61],
    [0.5, 2, 29.46],
  ])('image rejection with %f dB and %f° is %f dB (published relation)', (dB, deg, expected) => {
    const errors = { amplitudeImbalanceDb: dB, phaseErrorDeg: deg };
    const { truth } = synthesizeSsb({ ...base, ...errors });
    expect(truth.imageRejectionDb).toBeCloseTo(expected, 2);
    expect(truth.imageRejectionDb).toBeCloseTo(imageRejectionDb(errors), 10);
    // The wanted line keeps its requested level whatever the errors.
    expect(db(truth.wantedTones[0].powerLinear)).toBeCloseTo(-6, 10);
  });

  it('makes the image in the samples, not only in the truth: the −f line has its power', () => {
    // Single-bin DFT at ±1000 Hz over 48 whole cycles (4800 samples) reads each line exactly.
    const { i, q, truth } = synthesizeSsb({ ...base, phaseErrorDeg: 2 });
    const line = (f: number): number => {
      let re = 0;
      let im = 0;
      for (let n = 0; n < i.length; n++) {
        const a = (-2 * Math.PI * f * n) / 48000;
        re += i[n] * Math.cos(a) - q[n] * Math.sin(a);
        im += i[n] * Math.sin(a) + q[n] * Math.cos(a);
      }
      return (re * re + im * im) / i.length ** 2;
    };
    expect(db(line(1000) / line(-1000))).toBeCloseTo(35.16, 2);
    expect(line(-1000)).toBeCloseTo(truth.imageTones[0].powerLinear, 8);
  });

  it('two equal tones: PEP = tone + 6.02 dB, mean = tone + 3.01 dB (n²·P, n·P: published)', () => {
    const { truth, i, q } = synthesizeSsb({
      ...base,
      tones: [{ audioHz: 1100, levelDbfs: -10 }, { audioHz: 1700, levelDbfs: -10 }],
    });
    expect(db(truth.nominalPepLinear)).toBeCloseTo(-3.98, 2);
    expect(db(truth.meanPowerLinear)).toBeCloseTo(-6.99, 2);
    // Both start in phase, so the crest is sampled at n = 0.
    expect(db(truth.pepLinear)).toBeCloseTo(-3.98, 2);
    expect(db(i[0] * i[0] + q[0] * q[0])).toBeCloseTo(db(truth.pepLinear), 5);
  });

  it('adds carrier leak and IMD products at their levels below the nominal PEP', () => {
    const { truth } = synthesizeSsb({
      ...base,
      tones: [{ audioHz: 1100, levelDbfs: -10 }, { audioHz: 1700, levelDbfs: -10 }],
      carrierLeakBelowPepDb: 50,
      intermod: [{ order: 3, belowPepDb: 30 }, { order: 5, belowPepDb: 45, side: 'upper' }],
    });
    expect(db(truth.nominalPepLinear / truth.carrierPowerLinear)).toBeCloseTo(50, 10);
    // 1100/1700 Hz: IM3 at 500 and 2300 Hz, IM5 at −100 and 2900 Hz (common practice).
    expect(truth.intermodProducts.map((p) => [p.order, p.frequencyHz])).toEqual([
      [3, 500],
      [3, 2300],
      [5, 2900],
    ]);
    expect(db(truth.nominalPepLinear / truth.intermodProducts[2].powerLinear)).toBeCloseTo(45, 10);
  });

  it('adds seeded noise of the requested power, the same for the same seed', () => {
    const spec: SsbSignalSpec = {
      ...base,
      sampleCount: 48000,
      tones: [{ audioHz: 1000, levelDbfs: -100 }],
      noise: { powerDbfs: -20, seed: 4 },
    };
    const a = synthesizeSsb(spec);
    const b = synthesizeSsb(spec);
    expect(Array.from(a.q.subarray(0, 50))).toEqual(Array.from(b.q.subarray(0, 50)));
    let p = 0;
    for (let n = 0; n < a.i.length; n++) p += (a.i[n] ** 2 + a.q[n] ** 2) / a.i.length;
    expect(db(p)).toBeCloseTo(-20, 1); // 48000 samples: ±0.05 dB scatter
    expect(db(a.truth.meanPowerLinear)).toBeCloseTo(-20, 3);
  });

  it('rejects bad specs, naming the function', () => {
    const bad: Partial<SsbSignalSpec>[] = [
      { sampleRateHz: 0 },
      { sampleCount: 0 },
      { sampleCount: 2.5 },
      { sideband: 'dsb' as 'usb' },
      { tones: [] },
      { tones: [{ audioHz: 30000, levelDbfs: 0 }] },
      { tones: [{ audioHz: -5, levelDbfs: 0 }] },
      { tones: [{ audioHz: 1000, levelDbfs: NaN }] },
      { phaseErrorDeg: 95 },
      { amplitudeImbalanceDb: Infinity },
      { intermod: [{ order: 3, belowPepDb: 30 }] }, // one tone only
      { noise: { powerDbfs: -50, seed: 0.5 } },
    ];
    for (const override of bad) {
      expect(() => synthesizeSsb({ ...base, ...override })).toThrow(/^synthesizeSsb: /);
    }
  });
});

describe('createSsbSignalStream', () => {
  const spec: SsbSignalSpec = {
    sampleRateHz: 192000,
    sampleCount: 100000,
    sideband: 'lsb',
    tones: [{ audioHz: 1100.3, levelDbfs: -10 }, { audioHz: 1700, levelDbfs: -10, phaseDeg: 30 }],
    phaseErrorDeg: 1,
    carrierLeakBelowPepDb: 40,
    intermod: [{ order: 3, belowPepDb: 35 }],
    noise: { powerDbfs: -60, seed: 8 },
  };

  it('delivers the same samples in chunks as in one piece (phasors restarted exactly)', () => {
    const whole = synthesizeSsb(spec);
    const stream = createSsbSignalStream(spec, { chunkLength: 7777 });
    let pos = 0;
    let largestDifference = 0;
    for (let c = stream.next(); c !== null; c = stream.next()) {
      for (let k = 0; k < c.i.length; k++) {
        const d = Math.abs(c.i[k] - whole.i[pos + k]) + Math.abs(c.q[k] - whole.q[pos + k]);
        largestDifference = Math.max(largestDifference, d);
      }
      pos += c.i.length;
    }
    expect(pos).toBe(spec.sampleCount);
    expect(largestDifference).toBeLessThan(1e-6); // float32 rounding of a 1e-11 phasor drift
    expect(stream.truth().pepLinear).toBeCloseTo(whole.truth.pepLinear, 12);
  });

  it('makes a 10 s × 192 kS/s capture chunk by chunk without holding it', () => {
    const stream = createSsbSignalStream({ ...spec, sampleCount: 1_920_000, noise: undefined });
    let count = 0;
    let largest = 0;
    for (let c = stream.next(); c !== null; c = stream.next()) {
      count += c.i.length;
      largest = Math.max(largest, c.i.length);
    }
    expect(count).toBe(1_920_000);
    expect(largest).toBe(65536);
  });

  it('rejects a bad chunk length', () => {
    const make = () => createSsbSignalStream(spec, { chunkLength: 0 });
    expect(make).toThrow(/^createSsbSignalStream: chunkLength/);
  });
});
