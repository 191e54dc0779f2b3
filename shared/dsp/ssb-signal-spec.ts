import { intermodProductFrequencies } from '../measurements/intermod-product-frequencies';
import { requireFinite, requirePositive } from '../units/number-guards';

/** One audio tone into the modulator: its wanted RF tone will have power levelDbfs. */
export interface SsbToneSpec {
  audioHz: number;
  levelDbfs: number;
  /** Start phase, degrees; default 0. */
  phaseDeg?: number;
}

/** Intermodulation products added at a level below the nominal PEP (see {@link SsbTruth}). */
export interface IntermodSpec {
  order: 3 | 5;
  belowPepDb: number;
  /** Which of the pair (f1 − kΔ, f2 + kΔ) to add; default 'both'. */
  side?: 'both' | 'lower' | 'upper';
}

/** What to synthesize: a phasing-method SSB emission at complex baseband (carrier at 0 Hz). */
export interface SsbSignalSpec {
  sampleRateHz: number;
  sampleCount: number;
  sideband: 'usb' | 'lsb';
  tones: SsbToneSpec[];
  /** Q-path gain relative to I, dB; default 0. */
  amplitudeImbalanceDb?: number;
  /** Q-path quadrature error, degrees; default 0. */
  phaseErrorDeg?: number;
  /** Residual carrier, dB below the nominal PEP; default none. */
  carrierLeakBelowPepDb?: number;
  intermod?: IntermodSpec[];
  /** Complex white Gaussian noise of this total power (dBFS) from this seed; default none. */
  noise?: { powerDbfs: number; seed: number };
}

/** A spectral line of the synthesized signal at complex baseband. */
export interface SpectralLine {
  frequencyHz: number;
  powerLinear: number;
}

/** What the synthesized signal contains, from the closed-form relations (linear, full scale² units). */
export interface SsbTruth {
  /** (Σ √P_wanted)²: the crest when the wanted tones align; n equal tones → n²·P (published). */
  nominalPepLinear: number;
  /** max |x|² over the noiseless samples generated so far (the sampled crest, carrier and products included). */
  pepLinear: number;
  /** Σ of every line's power plus the noise power: the expected mean |x|². */
  meanPowerLinear: number;
  wantedTones: SpectralLine[];
  imageTones: SpectralLine[];
  carrierPowerLinear: number;
  intermodProducts: (SpectralLine & { order: 3 | 5 })[];
  noisePowerLinear: number;
  /** Wanted/image power ratio of every tone, dB: (1 + 2g·cos φ + g²)/(1 − 2g·cos φ + g²). */
  imageRejectionDb: number;
}

/** A validated plan: the modulator's tones (I/Q amplitudes) and the added lines. */
export interface SsbPlan {
  spec: SsbSignalSpec;
  sideSign: 1 | -1;
  /** Per tone: audio frequency, I amplitude A, Q amplitudes g·A·cos φ and g·A·sin φ, phase rad. */
  modulatorTones: { audioHz: number; amplitude: number; qCos: number; qSin: number; phaseRad: number }[];
  /** Lines added directly at baseband (carrier at 0 Hz, products). */
  addedLines: { frequencyHz: number; amplitude: number }[];
  truth: Omit<SsbTruth, 'pepLinear'>;
}

/**
 * Validates a spec and works out amplitudes and the expected spectrum. With I = A·cos(ωt + θ)
 * and Q = ±g·A·sin(ωt + θ + φ), the wanted line has power A²(1 + 2g·cos φ + g²)/4 and its image
 * A²(1 − 2g·cos φ + g²)/4 (the phasing-method image relation, published); A is chosen so the
 * wanted line has the requested level. Throws RangeErrors starting with `fn`.
 */
export function planSsbSignal(fn: string, spec: SsbSignalSpec): SsbPlan {
  const fs = requirePositive(fn, 'sampleRateHz', spec.sampleRateHz);
  if (!Number.isInteger(spec.sampleCount) || spec.sampleCount < 1) {
    throw new RangeError(`${fn}: sampleCount must be an integer ≥ 1, got ${spec.sampleCount}`);
  }
  if (spec.sideband !== 'usb' && spec.sideband !== 'lsb') {
    throw new RangeError(`${fn}: sideband must be 'usb' or 'lsb', got ${String(spec.sideband)}`);
  }
  if (!Array.isArray(spec.tones) || spec.tones.length === 0) {
    throw new RangeError(`${fn}: at least one tone is needed`);
  }
  const sideSign = spec.sideband === 'usb' ? 1 : -1;
  const g = 10 ** (requireFinite(fn, 'amplitudeImbalanceDb', spec.amplitudeImbalanceDb ?? 0) / 20);
  const phi = (requireFinite(fn, 'phaseErrorDeg', spec.phaseErrorDeg ?? 0) * Math.PI) / 180;
  if (Math.abs(phi) >= Math.PI / 2) throw new RangeError(`${fn}: phaseErrorDeg must be within ±90°`);
  // (1 ± 2g·cos φ + g²)/4, written with sin²(φ/2) so small errors do not cancel.
  const s2 = 4 * g * Math.sin(phi / 2) ** 2;
  const wantedGain = ((1 + g) ** 2 - s2) / 4;
  const imageGain = ((1 - g) ** 2 + s2) / 4;
  const inBand = (what: string, f: number): number => {
    if (!(Math.abs(f) < fs / 2)) throw new RangeError(`${fn}: ${what} at ${f} Hz is outside ±fs/2`);
    return f;
  };

  const modulatorTones = spec.tones.map((tone, k) => {
    const audioHz = requirePositive(fn, `tones[${k}].audioHz`, tone.audioHz);
    inBand(`tones[${k}]`, audioHz);
    const power = 10 ** (requireFinite(fn, `tones[${k}].levelDbfs`, tone.levelDbfs) / 10);
    const amplitude = Math.sqrt(power / wantedGain);
    const phaseRad = (requireFinite(fn, `tones[${k}].phaseDeg`, tone.phaseDeg ?? 0) * Math.PI) / 180;
    return { audioHz, power, amplitude, qCos: g * amplitude * Math.cos(phi), qSin: g * amplitude * Math.sin(phi), phaseRad };
  });
  const wantedTones = modulatorTones.map((t) => ({ frequencyHz: sideSign * t.audioHz, powerLinear: t.power }));
  const imageTones = modulatorTones.map((t) => ({
    frequencyHz: -sideSign * t.audioHz,
    powerLinear: t.amplitude * t.amplitude * imageGain,
  }));
  let rootSum = 0;
  for (const t of modulatorTones) rootSum += Math.sqrt(t.power);
  const nominalPepLinear = rootSum * rootSum;

  const addedLines: { frequencyHz: number; amplitude: number }[] = [];
  let carrierPowerLinear = 0;
  if (spec.carrierLeakBelowPepDb !== undefined) {
    carrierPowerLinear = nominalPepLinear * 10 ** (-requireFinite(fn, 'carrierLeakBelowPepDb', spec.carrierLeakBelowPepDb) / 10);
    addedLines.push({ frequencyHz: 0, amplitude: Math.sqrt(carrierPowerLinear) });
  }
  const intermodProducts: (SpectralLine & { order: 3 | 5 })[] = [];
  for (const [k, im] of (spec.intermod ?? []).entries()) {
    if (modulatorTones.length < 2) throw new RangeError(`${fn}: intermod products need two tones`);
    const [a, b] = [...modulatorTones].sort((x, y) => y.power - x.power);
    const freqs = intermodProductFrequencies({ tone1Hz: a.audioHz, tone2Hz: b.audioHz, order: im.order });
    const powerLinear = nominalPepLinear * 10 ** (-requireFinite(fn, `intermod[${k}].belowPepDb`, im.belowPepDb) / 10);
    const side = im.side ?? 'both';
    const audio = side === 'both' ? [freqs.lowerHz, freqs.upperHz] : [side === 'lower' ? freqs.lowerHz : freqs.upperHz];
    for (const f of audio) {
      const frequencyHz = inBand(`intermod[${k}]`, sideSign * f);
      intermodProducts.push({ order: im.order, frequencyHz, powerLinear });
      addedLines.push({ frequencyHz, amplitude: Math.sqrt(powerLinear) });
    }
  }
  const noisePowerLinear = spec.noise === undefined ? 0 : 10 ** (requireFinite(fn, 'noise.powerDbfs', spec.noise.powerDbfs) / 10);
  if (spec.noise !== undefined && !Number.isInteger(spec.noise.seed)) {
    throw new RangeError(`${fn}: noise.seed must be an integer`);
  }
  let meanPowerLinear = carrierPowerLinear + noisePowerLinear;
  for (const line of [...wantedTones, ...imageTones, ...intermodProducts]) meanPowerLinear += line.powerLinear;
  return {
    spec,
    sideSign,
    modulatorTones,
    addedLines,
    truth: {
      nominalPepLinear,
      meanPowerLinear,
      wantedTones,
      imageTones,
      carrierPowerLinear,
      intermodProducts,
      noisePowerLinear,
      imageRejectionDb: 10 * Math.log10(wantedGain / imageGain),
    },
  };
}
