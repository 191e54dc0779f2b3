import type { SsbTruth } from '../../shared/dsp/ssb-signal-spec';

const db = (linear: number): number | null => (linear > 0 ? 10 * Math.log10(linear) : null);

/** The synthesizer's known truth in decibels, as printed by `synthesize --json`. */
export interface SsbTruthReport {
  nominalPepDbfs: number | null;
  /** Crest of the samples actually written (noise excluded). */
  pepDbfs: number | null;
  meanPowerDbfs: number | null;
  carrierDbfs: number | null;
  noisePowerDbfs: number | null;
  imageRejectionDb: number;
  wantedTones: Array<{ frequencyHz: number; levelDbfs: number | null }>;
  imageTones: Array<{ frequencyHz: number; levelDbfs: number | null }>;
  intermodProducts: Array<{ order: 3 | 5; frequencyHz: number; levelDbfs: number | null }>;
}

/**
 * Converts the synthesizer's linear truth (full scale² units) into dBFS: 10 log10(P); a power
 * of zero (no carrier, no noise) is null rather than -Infinity, so the JSON stays plain.
 *
 * @example ssbTruthReport(truth).nominalPepDbfs // -5.98 for two tones of -12 dBFS
 */
export function ssbTruthReport(truth: SsbTruth): SsbTruthReport {
  const line = (l: { frequencyHz: number; powerLinear: number }) => ({
    frequencyHz: l.frequencyHz,
    levelDbfs: db(l.powerLinear),
  });
  return {
    nominalPepDbfs: db(truth.nominalPepLinear),
    pepDbfs: db(truth.pepLinear),
    meanPowerDbfs: db(truth.meanPowerLinear),
    carrierDbfs: db(truth.carrierPowerLinear),
    noisePowerDbfs: db(truth.noisePowerLinear),
    imageRejectionDb: truth.imageRejectionDb,
    wantedTones: truth.wantedTones.map(line),
    imageTones: truth.imageTones.map(line),
    intermodProducts: truth.intermodProducts.map((p) => ({ order: p.order, ...line(p) })),
  };
}
