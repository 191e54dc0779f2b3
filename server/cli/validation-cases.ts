import type { SsbSignalSpec } from '../../shared/dsp/ssb-signal-spec';
import type { IqAnalysis } from '../../shared/iq/analyze-iq';
import type { SsbTruthReport } from './ssb-truth-report';

/** One compared quantity of the software validation record. */
export interface ValidationCheck {
  quantity: string;
  unit: string;
  expected: number | string | null;
  tolerance: number;
  /** Where the expected value comes from. */
  source: string;
  measured(analysis: IqAnalysis): number | string | null;
}

/** A synthesized signal, the path it takes through the importers, and what must be measured. */
export interface ValidationCase {
  name: string;
  spec: SsbSignalSpec;
  /** Format the samples are encoded to and decoded from, so the importer is validated too. */
  datatype: 'cf32_le' | 'ci16_le';
  fullScaleDbm?: number;
  checks(truth: SsbTruthReport): ValidationCheck[];
}

const TRUTH = 'synthesizer closed-form truth';
const dbOrNull = (value: number | null | undefined) => value ?? null;

function toneLevel(analysis: IqAnalysis, frequencyHz: number): number | null {
  const near = analysis.tones.filter((t) => Math.abs(t.frequencyHz - frequencyHz) < 5);
  return near.length === 0 ? null : near[0].levelDbfs;
}

function strongestProduct(truth: SsbTruthReport, order: 3 | 5): number | null {
  const levels = truth.intermodProducts
    .filter((p) => p.order === order)
    .map((p) => p.levelDbfs ?? -Infinity);
  return levels.length === 0 ? null : Math.max(...levels);
}

/**
 * The self-validation suite (ISO/IEC 17025:2017 7.11.2: computation software is validated
 * before use). Expected values come from published relations where one exists (n equal tones:
 * PEP = n^2 Pt, mean = n Pt; the phasing-method image relation) and otherwise from the
 * synthesizer's closed-form truth. Tolerances are our acceptance limits (common practice).
 */
export const VALIDATION_CASES: ValidationCase[] = [
  {
    name: 'two equal tones, ideal modulator (absolute levels)',
    spec: {
      sampleRateHz: 48000,
      sampleCount: 96000,
      sideband: 'usb',
      tones: [
        { audioHz: 1100, levelDbfs: -10 },
        { audioHz: 1700, levelDbfs: -10 },
      ],
    },
    datatype: 'cf32_le',
    fullScaleDbm: 0,
    checks: () => [
      // Two tones of -10.00 dBm: PEP = Pt + 6.02 dB = -3.98 dBm; mean = Pt + 3.01 dB = -6.99 dBm.
      check('pepDbm', 'dBm', -3.98, 0.05, 'n equal tones: PEP = n^2 Pt', (a) => a.pepDbm),
      check('meanPowerDbm', 'dBm', -6.99, 0.05, 'n equal tones: mean = n Pt', (a) =>
        a.meanPowerDbm),
      check('sideband', '', 'usb', 0, 'as synthesized', (a) => a.sideband),
      check('tone 1100 Hz level', 'dBFS', -10, 0.3, 'as synthesized', (a) => toneLevel(a, 1100)),
      check('tone 1700 Hz level', 'dBFS', -10, 0.3, 'as synthesized', (a) => toneLevel(a, 1700)),
    ],
  },
  {
    name: 'two-tone test with carrier leak, 1 degree phase error, IMD3/IMD5 and noise',
    spec: {
      sampleRateHz: 48000,
      sampleCount: 96000,
      sideband: 'usb',
      tones: [
        { audioHz: 700, levelDbfs: -12 },
        { audioHz: 1900, levelDbfs: -12 },
      ],
      phaseErrorDeg: 1,
      carrierLeakBelowPepDb: 50,
      intermod: [
        { order: 3, belowPepDb: 35 },
        { order: 5, belowPepDb: 45 },
      ],
      noise: { powerDbfs: -100, seed: 17011 },
    },
    datatype: 'cf32_le',
    checks: (truth) => [
      check('pepDbfs', 'dBFS', truth.pepDbfs, 0.1, TRUTH + ' (sampled crest)', (a) => a.pepDbfs),
      check('meanPowerDbfs', 'dBFS', truth.meanPowerDbfs, 0.05, TRUTH, (a) => a.meanPowerDbfs),
      belowPep('carrierSuppressionDb', truth, truth.carrierDbfs, (a) => a.carrierSuppressionDb),
      // Phasing-method image relation: 1 degree alone gives 41.18 dB.
      check('unwantedSidebandSuppressionDb', 'dB', 41.18, 0.3, 'IRR = cot^2(phi/2), 1 deg', (a) =>
        a.unwantedSidebandSuppressionDb),
      belowPep('imd3Db', truth, strongestProduct(truth, 3), (a) => a.imd3Db),
      belowPep('imd5Db', truth, strongestProduct(truth, 5), (a) => a.imd5Db),
    ],
  },
  {
    name: 'single tone LSB at 192 kS/s through ci16, 0.1 dB and 1 degree imbalance',
    spec: {
      sampleRateHz: 192000,
      sampleCount: 192000,
      sideband: 'lsb',
      tones: [{ audioHz: 1000, levelDbfs: -6 }],
      amplitudeImbalanceDb: 0.1,
      phaseErrorDeg: 1,
      carrierLeakBelowPepDb: 40,
      noise: { powerDbfs: -70, seed: 29 },
    },
    datatype: 'ci16_le',
    fullScaleDbm: 50,
    checks: (truth) => [
      check('sideband', '', 'lsb', 0, 'as synthesized', (a) => a.sideband),
      // IRR = (1 + 2g cos(phi) + g^2) / (1 - 2g cos(phi) + g^2): 0.1 dB and 1 degree -> 39.61 dB.
      check('unwantedSidebandSuppressionDb', 'dB', 39.61, 0.3, 'phasing image relation', (a) =>
        a.unwantedSidebandSuppressionDb),
      belowPep('carrierSuppressionDb', truth, truth.carrierDbfs, (a) => a.carrierSuppressionDb),
      check('tone -1000 Hz level', 'dBFS', -6, 0.3, 'as synthesized', (a) => toneLevel(a, -1000)),
      check('imd3Db', '', null, 0, 'one tone: no two-tone products', (a) => a.imd3Db),
    ],
  },
];

function check(
  quantity: string,
  unit: string,
  expected: number | string | null,
  tolerance: number,
  source: string,
  measured: (analysis: IqAnalysis) => number | string | null,
): ValidationCheck {
  return { quantity, unit, expected, tolerance, source, measured };
}

/** A level below the sampled PEP: expected = PEP - level (dB), both from the truth. */
function belowPep(
  quantity: string,
  truth: SsbTruthReport,
  levelDbfs: number | null,
  measured: (analysis: IqAnalysis) => number | null,
): ValidationCheck {
  const expected = truth.pepDbfs === null || levelDbfs === null ? null : truth.pepDbfs - levelDbfs;
  return check(quantity, 'dB', dbOrNull(expected), 0.3, TRUTH + ', re sampled PEP', measured);
}
