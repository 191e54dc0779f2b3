/**
 * Built-in rule sets shipped as SAMPLES. Each limit names its source and edition; the ones we
 * hold only from memory say so. A lab must verify every number against the current edition of
 * the standard before it tests against it, then copy the sample into a rule set of its own.
 */
import type { RuleSetBody } from './rule-set';
import type { UncertaintyContribution } from '../uncertainty/uncertainty-contribution';

const SAMPLE_NOTICE =
  'Sample rule set shipped with Sidecheck. Verify every limit against the current edition of each referenced document before use; copy it to make your own.';

/** Relative readings in one sweep cancel absolute-level terms; these values are examples to replace. */
const RELATIVE_BUDGET: RuleSetBody['uncertainty']['relative'] = [
  { name: 'Analyzer scale fidelity (example)', distribution: 'rectangular', value: 0.5 },
  { name: 'Repeatability (example)', distribution: 'normal', value: 0.2, coverageFactor: 2 },
  { name: 'Reading resolution (example)', distribution: 'rectangular', value: 0.05 },
];
const ABSOLUTE_BUDGET: RuleSetBody['uncertainty']['absolute'] = [
  { name: 'Analyzer absolute amplitude accuracy (example)', distribution: 'rectangular', value: 1.0 },
  { name: 'Mismatch, VSWR 1.2 : 1.5 (example)', distribution: 'u-shaped', value: 0.17 },
  { name: 'Attenuator and coupler calibration (example)', distribution: 'normal', value: 0.2, coverageFactor: 2 },
  { name: 'Repeatability (example)', distribution: 'normal', value: 0.2, coverageFactor: 2 },
];

const FREQUENCY_BUDGET: UncertaintyContribution[] = [
  { name: 'Counter resolution (example)', distribution: 'rectangular', value: 0.5 },
  { name: 'Timebase, 0.05 ppm at 30 MHz (example)', distribution: 'rectangular', value: 1.5 },
];
const BANDWIDTH_BUDGET: UncertaintyContribution[] = [
  { name: 'Trace bin spacing (example)', distribution: 'rectangular', value: 15 },
  { name: 'Repeatability (example)', distribution: 'normal', value: 20, coverageFactor: 2 },
];
const BUDGETS = { relative: RELATIVE_BUDGET, absolute: ABSOLUTE_BUDGET, frequencyHz: FREQUENCY_BUDGET, bandwidthHz: BANDWIDTH_BUDGET };

export interface SampleRuleSet {
  key: string;
  name: string;
  version: number;
  body: RuleSetBody;
}

export const SAMPLE_RULE_SETS: SampleRuleSet[] = [
  {
    key: 'us-maritime-hf-ssb',
    name: 'Maritime HF radiotelephone, J3E (US, 47 CFR 80)',
    version: 1,
    body: {
      service: 'maritime',
      description: 'Ship and coast station SSB transmitters, 1.6-27.5 MHz, J3E.',
      sampleNotice: SAMPLE_NOTICE,
      references: [
        { document: '47 CFR 80.207', clause: '(c)', edition: '2024' },
        { document: '47 CFR 80.209', edition: '2024' },
        { document: '47 CFR 80.211', clause: '(a)', edition: '2024' },
        { document: 'ITU-R M.1173', edition: 'from memory: verify current edition' },
      ],
      decisionRule: { kind: 'simple-acceptance' },
      limits: {
        carrierSuppression: { minDbBelowPep: 40, source: '47 CFR 80.207(c), 2024' },
        unwantedSideband: { minDb: 40, source: 'ITU-R M.1173, ship stations (from memory: verify)' },
        intermodulation: { minDbBelowPep: 25, source: 'Lab practice, example value: set from your standard' },
        emissionMask: {
          reference: 'mean',
          // 47 CFR 80.211(a) with an authorized bandwidth of 3.0 kHz (offsets from the assigned frequency).
          vertices: [
            [1500, 0],
            [1500, -28],
            [4500, -28],
            [4500, -35],
            [7500, -35],
            [7500, -63],
          ],
          referenceBandwidthHz: 3000,
          source: '47 CFR 80.211(a), 2024, authorized bandwidth 3.0 kHz, 100 W mean power for the last step',
        },
        spurious: { baseDb: 43, reference: 'mean', referenceBandwidthHz: 10000, source: '47 CFR 80.211(a)(3), 2024: 43 + 10 log10(P/W) dB' },
        frequencyTolerance: { toleranceHz: 20, source: '47 CFR 80.209, 2024' },
        audioResponse: { lowHz: 350, highHz: 2700, maxVariationDb: 6, source: 'ITU-R M.1173 section 3' },
        occupiedBandwidth: { maxHz: 3000, source: 'Authorized bandwidth 3.0 kHz (47 CFR 80.205, from memory: verify)' },
      },
      uncertainty: BUDGETS,
    },
  },
  {
    key: 'us-aviation-hf-ssb',
    name: 'Aeronautical HF SSB, aircraft station (US, 47 CFR 87)',
    version: 1,
    body: {
      service: 'aeronautical',
      description: 'Aircraft station SSB transmitters; assigned frequency = carrier + 1400 Hz.',
      sampleNotice: SAMPLE_NOTICE,
      references: [
        { document: '47 CFR 87.141', clause: '(d)', edition: '2024' },
        { document: '47 CFR 87.139', clause: '(c)', edition: 'from memory: verify current edition' },
        { document: '47 CFR 87.133', edition: '2024' },
      ],
      decisionRule: { kind: 'non-binary', guardBand: 'expanded-uncertainty' },
      limits: {
        carrierSuppression: { minDbBelowPep: 26, source: '47 CFR 87.141(d), 2024, aircraft stations' },
        emissionMask: {
          reference: 'pep',
          assignedOffsetHz: 1400,
          vertices: [
            [1500, 0],
            [1500, -30],
            [4500, -30],
            [4500, -38],
            [7500, -38],
            [7500, -43],
          ],
          source: '47 CFR 87.139(c) / RR Appendix 27 (from memory: verify)',
        },
        frequencyTolerance: { toleranceHz: 20, source: '47 CFR 87.133, aircraft (from memory: verify)' },
      },
      uncertainty: BUDGETS,
    },
  },
  {
    key: 'us-amateur-hf',
    name: 'Amateur HF transmitter (US, 47 CFR 97)',
    version: 1,
    body: {
      service: 'amateur',
      description: 'Amateur transmitters below 30 MHz installed after 2003.',
      sampleNotice: SAMPLE_NOTICE,
      references: [{ document: '47 CFR 97.307', clause: '(d)', edition: '2024' }],
      decisionRule: { kind: 'binary-guard-band', guardBand: 'expanded-uncertainty' },
      limits: {
        spurious: { baseDb: 43, reference: 'mean', referenceBandwidthHz: 10000, source: '47 CFR 97.307(d), 2024: at least 43 dB below mean power' },
        carrierSuppression: { minDbBelowPep: 40, source: 'Lab practice for J3E, example value (97.307 sets no number)' },
      },
      uncertainty: BUDGETS,
    },
  },
];
