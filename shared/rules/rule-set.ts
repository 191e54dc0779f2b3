/**
 * A rule set: the limits a lab tests against, with the edition of every document they come from.
 * Stored as a versioned JSON body; a test plan keeps a snapshot, so editing a rule set later never
 * changes a test already done with it.
 */
import type { DecisionRule } from '../uncertainty/decision-rule';
import type { UncertaintyContribution } from '../uncertainty/uncertainty-contribution';

export interface DocumentReference {
  document: string; // e.g. "47 CFR 80.207(c)"
  clause?: string;
  edition: string; // e.g. "2024"
}

export interface LimitSource {
  /** Where the number comes from, with its edition. */
  source: string;
}

export interface RuleSetBody {
  service: 'maritime' | 'aeronautical' | 'land-mobile' | 'amateur' | 'broadcast' | 'other';
  description: string;
  references: DocumentReference[];
  /** Present on built-in samples: verify every limit against the current edition before use. */
  sampleNotice?: string;
  decisionRule: DecisionRule;
  limits: {
    carrierSuppression?: LimitSource & { minDbBelowPep: number };
    unwantedSideband?: LimitSource & { minDb: number };
    intermodulation?: LimitSource & { minDbBelowPep: number };
    emissionMask?: LimitSource & {
      reference: 'pep' | 'mean';
      /** [offsetHz from the assigned frequency, limit dB relative to the reference (<= 0)]. */
      vertices: [number, number][];
      /** Assigned frequency minus carrier frequency (e.g. +1400 Hz in aeronautical practice). */
      assignedOffsetHz?: number;
      referenceBandwidthHz?: number;
    };
    spurious?: LimitSource & {
      baseDb: number; // 43 in "43 + 10 log10(P/W) dB"
      capDbc?: number;
      capRule?: 'less-stringent' | 'more-stringent';
      reference: 'pep' | 'mean';
      referenceBandwidthHz: number;
    };
    occupiedBandwidth?: LimitSource & { maxHz: number };
    frequencyTolerance?: LimitSource & { toleranceHz: number };
    audioResponse?: LimitSource & { lowHz: number; highHz: number; maxVariationDb: number };
  };
  /** Default uncertainty budgets; instruments add their own contributions. */
  uncertainty: {
    /** dB quantities read relative to another level in the same sweep (dBc, dB below PEP). */
    relative: UncertaintyContribution[];
    /** Absolute levels (dBm). */
    absolute: UncertaintyContribution[];
    /** Frequency readings, in Hz (counter resolution, timebase). */
    frequencyHz?: UncertaintyContribution[];
    /** Bandwidths read from a trace, in Hz (bin spacing, RBW shape). */
    bandwidthHz?: UncertaintyContribution[];
  };
}
