import { meanPowerFromEnvelope, pepFromEnvelope } from './envelope-power';

function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

describe('envelope power', () => {
  it('PEP is max |x|² and mean is the average |x|² (RR 1.157 / 1.158 definitions)', () => {
    expect(pepFromEnvelope([1, 0, -2], [0, 1, 0])).toBe(4);
    expect(meanPowerFromEnvelope([1, 0, -2], [0, 1, 0])).toBe(2);
  });

  it('a single tone has PEP = mean (common practice: single-tone PEP equals its power)', () => {
    const n = 1000;
    const i = Float64Array.from({ length: n }, (_, k) => 3 * Math.cos((2 * Math.PI * 7 * k) / n));
    const q = Float64Array.from({ length: n }, (_, k) => 3 * Math.sin((2 * Math.PI * 7 * k) / n));
    expect(pepFromEnvelope(i, q)).toBeCloseTo(9, 12);
    expect(meanPowerFromEnvelope(i, q)).toBeCloseTo(9, 12);
  });

  it('two equal tones: PEP/mean = 2 (3.01 dB), published n-tone relation', () => {
    // 1100 and 1700 Hz at 48 kHz repeat every 480 samples; 4800 samples = 10 full periods.
    const n = 4800;
    const i = new Float64Array(n);
    const q = new Float64Array(n);
    for (let k = 0; k < n; k++) {
      const t = k / 48000;
      i[k] = Math.cos(2 * Math.PI * 1100 * t) + Math.cos(2 * Math.PI * 1700 * t);
      q[k] = Math.sin(2 * Math.PI * 1100 * t) + Math.sin(2 * Math.PI * 1700 * t);
    }
    expect(pepFromEnvelope(i, q)).toBeCloseTo(4, 12);
    expect(meanPowerFromEnvelope(i, q)).toBeCloseTo(2, 12);
  });

  it('matches a direct mean of seeded random samples', () => {
    const rand = mulberry32(99);
    const n = 10_000;
    const i = Float64Array.from({ length: n }, () => rand() * 2 - 1);
    const q = Float64Array.from({ length: n }, () => rand() * 2 - 1);
    let sum = 0;
    let peak = 0;
    for (let k = 0; k < n; k++) {
      sum += i[k] ** 2 + q[k] ** 2;
      peak = Math.max(peak, Math.hypot(i[k], q[k]) ** 2);
    }
    expect(meanPowerFromEnvelope(i, q)).toBeCloseTo(sum / n, 12);
    expect(pepFromEnvelope(i, q)).toBeCloseTo(peak, 12);
  });

  it('one sample is both PEP and mean', () => {
    expect(pepFromEnvelope([3], [4])).toBe(25);
    expect(meanPowerFromEnvelope([3], [4])).toBe(25);
  });

  it('throws on empty, mismatched or non-finite input', () => {
    expect(() => pepFromEnvelope([], [])).toThrow(/^pepFromEnvelope: the envelope is empty/);
    expect(() => meanPowerFromEnvelope([1], [1, 2])).toThrow(/^meanPowerFromEnvelope: i and q/);
    expect(() => pepFromEnvelope([1, NaN], [0, 0])).toThrow(/^pepFromEnvelope: sample 1/);
    expect(() => meanPowerFromEnvelope([Infinity], [0])).toThrow(RangeError);
    expect(() => pepFromEnvelope(undefined as unknown as number[], [])).toThrow(TypeError);
  });
});
