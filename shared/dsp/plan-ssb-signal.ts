import { intermodProductFrequencies } from '../measurements/intermod-product-frequencies';
import { requireFinite, requirePositive } from '../units/number-guards';
import type { IntermodSpec, SpectralLine, SsbSignalSpec, SsbTruth } from './ssb-signal-spec';

/** One modulator tone: I = A·cos(ωt + θ), Q = ±(qCos·sin(ωt + θ) + qSin·cos(ωt + θ)). */
export interface ModulatorTone {
  audioHz: number;
  power: number;
  amplitude: number;
  /** g·A·cos φ and g·A·sin φ: the Q path's gain and quadrature error folded in. */
  qCos: number;
  qSin: number;
  phaseRad: number;
}

/** A validated plan: the modulator's tones and the lines added at baseband. */
export interface SsbPlan {
  spec: SsbSignalSpec;
  sideSign: 1 | -1;
  modulatorTones: ModulatorTone[];
  /** Lines added directly at baseband (carrier at 0 Hz, intermodulation products). */
  addedLines: { frequencyHz: number; amplitude: number }[];
  truth: Omit<SsbTruth, 'pepLinear'>;
}

type Product = SpectralLine & { order: 3 | 5 };

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
  if (Math.abs(phi) >= Math.PI / 2) {
    throw new RangeError(`${fn}: phaseErrorDeg must be within ±90°`);
  }
  // (1 ± 2g·cos φ + g²)/4, written with sin²(φ/2) so small errors do not cancel.
  const s2 = 4 * g * Math.sin(phi / 2) ** 2;
  const wantedGain = ((1 + g) ** 2 - s2) / 4;
  const imageGain = ((1 - g) ** 2 + s2) / 4;
  const inBand = (what: string, f: number): number => {
    if (!(Math.abs(f) < fs / 2)) throw new RangeError(`${fn}: ${what} at ${f} Hz is outside ±fs/2`);
    return f;
  };

  const modulatorTones = spec.tones.map((tone, k): ModulatorTone => {
    const audioHz = inBand(`tones[${k}]`, requirePositive(fn, `tones[${k}].audioHz`, tone.audioHz));
    const power = 10 ** (requireFinite(fn, `tones[${k}].levelDbfs`, tone.levelDbfs) / 10);
    const amplitude = Math.sqrt(power / wantedGain);
    const phaseDeg = requireFinite(fn, `tones[${k}].phaseDeg`, tone.phaseDeg ?? 0);
    const [qCos, qSin] = [g * amplitude * Math.cos(phi), g * amplitude * Math.sin(phi)];
    return { audioHz, power, amplitude, qCos, qSin, phaseRad: (phaseDeg * Math.PI) / 180 };
  });
  const wantedTones = modulatorTones.map((t) => line(sideSign * t.audioHz, t.power));
  const imageTones = modulatorTones.map((t) =>
    line(-sideSign * t.audioHz, t.amplitude ** 2 * imageGain),
  );
  const nominalPepLinear = modulatorTones.reduce((sum, t) => sum + Math.sqrt(t.power), 0) ** 2;
  const belowPep = (what: string, db: number | undefined): number =>
    nominalPepLinear * 10 ** (-requireFinite(fn, what, db) / 10);

  const addedLines: { frequencyHz: number; amplitude: number }[] = [];
  let carrierPowerLinear = 0;
  if (spec.carrierLeakBelowPepDb !== undefined) {
    carrierPowerLinear = belowPep('carrierLeakBelowPepDb', spec.carrierLeakBelowPepDb);
    addedLines.push({ frequencyHz: 0, amplitude: Math.sqrt(carrierPowerLinear) });
  }
  const intermodProducts: Product[] = [];
  for (const [k, im] of (spec.intermod ?? []).entries()) {
    if (modulatorTones.length < 2) throw new RangeError(`${fn}: intermod products need two tones`);
    const powerLinear = belowPep(`intermod[${k}].belowPepDb`, im.belowPepDb);
    for (const audioHz of productFrequencies(modulatorTones, im)) {
      const frequencyHz = inBand(`intermod[${k}]`, sideSign * audioHz);
      intermodProducts.push({ order: im.order, frequencyHz, powerLinear });
      addedLines.push({ frequencyHz, amplitude: Math.sqrt(powerLinear) });
    }
  }
  let noisePowerLinear = 0;
  if (spec.noise !== undefined) {
    noisePowerLinear = 10 ** (requireFinite(fn, 'noise.powerDbfs', spec.noise.powerDbfs) / 10);
    if (!Number.isInteger(spec.noise.seed)) {
      throw new RangeError(`${fn}: noise.seed must be an integer`);
    }
  }
  const lines = [...wantedTones, ...imageTones, ...intermodProducts];
  const meanPowerLinear =
    lines.reduce((sum, l) => sum + l.powerLinear, 0) + carrierPowerLinear + noisePowerLinear;
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

function line(frequencyHz: number, powerLinear: number): SpectralLine {
  return { frequencyHz, powerLinear };
}

/** Audio frequencies of the requested products of the two strongest tones (f1 − kΔ, f2 + kΔ). */
function productFrequencies(tones: ModulatorTone[], im: IntermodSpec): number[] {
  const [a, b] = [...tones].sort((x, y) => y.power - x.power);
  const { lowerHz, upperHz } = intermodProductFrequencies({
    tone1Hz: a.audioHz,
    tone2Hz: b.audioHz,
    order: im.order,
  });
  const side = im.side ?? 'both';
  return side === 'both' ? [lowerHz, upperHz] : [side === 'lower' ? lowerHz : upperHz];
}
