/** One audio tone into the modulator: its wanted RF tone will have power levelDbfs. */
export interface SsbToneSpec {
  audioHz: number;
  levelDbfs: number;
  /** Start phase, degrees; default 0. */
  phaseDeg?: number;
}

/** Intermodulation products added at a level below the nominal PEP (see SsbTruth). */
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

/** What the synthesized signal contains, from closed-form relations (linear, full-scale² units). */
export interface SsbTruth {
  /** (Σ √P_wanted)²: the crest when the wanted tones align; n equal tones → n²·P (published). */
  nominalPepLinear: number;
  /** max |x|² of the noiseless samples generated so far: the sampled crest, all lines included. */
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
