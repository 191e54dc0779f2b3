import { createComplexNoise } from './gaussian-noise';
import type { ComplexSamples } from './hilbert';
import { planSsbSignal, type SsbPlan } from './plan-ssb-signal';
import type { SsbSignalSpec, SsbTruth } from './ssb-signal-spec';

/** A long synthesized capture delivered in chunks; truth().pepLinear covers the chunks so far. */
export interface SsbSignalStream {
  readonly sampleCount: number;
  /** The next chunk (at most chunkLength samples), or null when the capture is complete. */
  next(): ComplexSamples<Float32Array> | null;
  truth(): SsbTruth;
}

/**
 * Reference SSB signal generator, chunked so a 10 s × 192 kS/s capture never needs to be held
 * whole. Phasing method at complex baseband: for each audio tone (ω, θ)
 *   I += A·cos(ωt + θ),   Q += ±g·A·sin(ωt + θ + φ)   (+ for USB, − for LSB)
 * with g = 10^(imbalance/20) and φ the phase error, so an imperfect modulator makes its own image
 * at −ω; then the residual carrier (a constant, 0 Hz), the intermodulation lines and seeded
 * complex Gaussian noise (mulberry32 + Box–Muller) are added. Tone levels, the carrier leak and
 * the products are set as documented in {@link SsbSignalSpec}; {@link SsbTruth} gives what the
 * signal contains.
 *
 * Source: phasing-method SSB and its image relation IRR = (1 + 2g·cos φ + g²)/(1 − 2g·cos φ + g²)
 * (published); intermod product frequencies f1 − kΔ, f2 + kΔ (common practice).
 * Oscillators: each chunk restarts every phasor from an exact cos/sin of its phase at the chunk's
 * first sample, then rotates it by e^(jω) per sample (drift < 1e-11 over a chunk).
 * Domain and bad input: see SsbSignalSpec (levels finite, frequencies within ±fs/2, |phase error|
 * < 90°, intermod only with two tones, integer seed); chunkLength an integer ≥ 1 (default 65536).
 * RangeErrors start with "createSsbSignalStream".
 *
 * @example
 * const s = createSsbSignalStream({ sampleRateHz: 192000, sampleCount: 1_920_000, sideband: 'usb',
 *   tones: [{ audioHz: 1100, levelDbfs: -12 }, { audioHz: 1700, levelDbfs: -12 }] });
 * for (let c = s.next(); c; c = s.next()) analyzer.push(c.i, c.q);
 */
export function createSsbSignalStream(
  spec: SsbSignalSpec,
  options: { chunkLength?: number } = {},
): SsbSignalStream {
  const fn = 'createSsbSignalStream';
  const plan = planSsbSignal(fn, spec);
  const chunkLength = options.chunkLength ?? 65536;
  if (!Number.isInteger(chunkLength) || chunkLength < 1) {
    throw new RangeError(`${fn}: chunkLength must be an integer ≥ 1, got ${chunkLength}`);
  }
  const noise =
    spec.noise === undefined
      ? null
      : createComplexNoise({ powerLinear: plan.truth.noisePowerLinear, seed: spec.noise.seed });
  let position = 0;
  let pepLinear = 0;
  return {
    sampleCount: spec.sampleCount,
    next() {
      if (position >= spec.sampleCount) return null;
      const count = Math.min(chunkLength, spec.sampleCount - position);
      const i = new Float32Array(count);
      const q = new Float32Array(count);
      pepLinear = Math.max(pepLinear, renderNoiseless(plan, position, i, q));
      noise?.addTo(i, q, 0, count);
      position += count;
      return { i, q };
    },
    truth: () => ({ ...plan.truth, pepLinear }),
  };
}

/**
 * The whole capture at once: {@link createSsbSignalStream} with one chunk. Bad input as there,
 * messages starting with "synthesizeSsb".
 * @example
 * synthesizeSsb({ sampleRateHz: 48000, sampleCount: 48000, sideband: 'usb',
 *   tones: [{ audioHz: 1000, levelDbfs: 0 }], phaseErrorDeg: 1 }).truth.imageRejectionDb; // 41.18
 */
export function synthesizeSsb(
  spec: SsbSignalSpec,
): ComplexSamples<Float32Array> & { truth: SsbTruth } {
  planSsbSignal('synthesizeSsb', spec);
  const stream = createSsbSignalStream(spec, { chunkLength: spec.sampleCount });
  const chunk = stream.next() as ComplexSamples<Float32Array>;
  return { i: chunk.i, q: chunk.q, truth: stream.truth() };
}

/** Writes samples start … start + i.length − 1 of the noiseless signal; returns their max |x|². */
function renderNoiseless(plan: SsbPlan, start: number, i: Float32Array, q: Float32Array): number {
  const count = i.length;
  const fs = plan.spec.sampleRateHz;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  for (const tone of plan.modulatorTones) {
    // I = A·cos α, Q = ±g·A·sin(α + φ) = ±(g·A·cos φ·sin α + g·A·sin φ·cos α).
    const qc = plan.sideSign * tone.qSin;
    const qs = plan.sideSign * tone.qCos;
    addPhasor(re, im, tone.audioHz / fs, tone.phaseRad, start, tone.amplitude, 0, qc, qs);
  }
  for (const line of plan.addedLines) {
    addPhasor(re, im, line.frequencyHz / fs, 0, start, line.amplitude, 0, 0, line.amplitude);
  }
  let peak = 0;
  for (let k = 0; k < count; k++) {
    i[k] = re[k];
    q[k] = im[k];
    peak = Math.max(peak, re[k] * re[k] + im[k] * im[k]);
  }
  return peak;
}

/**
 * Adds re[k] += ic·cos α + is·sin α and im[k] += qc·cos α + qs·sin α, α = 2π·ν·(start + k) + θ.
 * The phasor (cos α, sin α) starts from an exact cos/sin and is then rotated by e^(j2πν).
 */
function addPhasor(
  re: Float64Array,
  im: Float64Array,
  cyclesPerSample: number,
  phaseRad: number,
  start: number,
  ic: number,
  is: number,
  qc: number,
  qs: number,
): void {
  // Whole cycles dropped before scaling keep the start angle exact far into a long capture.
  const cycles = cyclesPerSample * start;
  const angle = 2 * Math.PI * (cycles - Math.floor(cycles)) + phaseRad;
  let c = Math.cos(angle);
  let s = Math.sin(angle);
  const dc = Math.cos(2 * Math.PI * cyclesPerSample);
  const ds = Math.sin(2 * Math.PI * cyclesPerSample);
  for (let k = 0; k < re.length; k++) {
    re[k] += ic * c + is * s;
    im[k] += qc * c + qs * s;
    const nc = c * dc - s * ds;
    s = s * dc + c * ds;
    c = nc;
  }
}
