import type { UncertaintyContribution } from './uncertainty-contribution';

/** A starting point for an uncertainty budget; every number is an example to replace. */
export interface BudgetTemplate {
  id: 'absolute-level' | 'relative-level';
  title: string;
  appliesTo: string;
  /** Why the rows are what they are. */
  note: string;
  contributions: readonly UncertaintyContribution[];
}

const EXAMPLE_NOTE =
  'Example values only: each lab must replace them with figures from its own instrument ' +
  'specifications, calibration certificates and repeatability studies.';

/**
 * Budget for absolute levels (PEP or mean power in dBm, absolute spurious levels). The example
 * values reproduce the common-practice worked check: u_c = 0.607 dB, U = 1.21 dB (k = 2).
 */
export const ABSOLUTE_LEVEL_BUDGET_TEMPLATE: BudgetTemplate = Object.freeze({
  id: 'absolute-level' as const,
  title: 'Absolute level (dBm)',
  appliesTo: 'PEP, mean power, absolute spurious levels read on the analyzer',
  note: `${EXAMPLE_NOTE} Mismatch enters as U-shaped (see mismatchLimitsDb).`,
  contributions: Object.freeze([
    {
      name: 'Analyzer absolute amplitude accuracy (example)',
      distribution: 'rectangular' as const,
      value: 1.0,
    },
    // ±0.1725 dB U-shaped → 0.122 dB standard
    {
      name: 'Mismatch, analyzer/attenuator (example)',
      distribution: 'u-shaped' as const,
      value: 0.1725,
    },
    {
      name: 'Attenuator/coupler calibration (example)',
      distribution: 'normal' as const,
      value: 0.2,
      coverageFactor: 2,
    },
    {
      name: 'Repeatability, standard deviation (example)',
      distribution: 'normal' as const,
      value: 0.1,
      coverageFactor: 1,
    },
  ]),
});

/**
 * Budget for relative measurements within one sweep (dBc, dB below PEP: carrier and sideband
 * suppression, IMD, mask margins): absolute-accuracy, attenuator and mismatch terms are common
 * to both readings and cancel (common practice), leaving scale fidelity, RBW switching when the
 * two readings use different RBWs, and repeatability.
 */
export const RELATIVE_LEVEL_BUDGET_TEMPLATE: BudgetTemplate = Object.freeze({
  id: 'relative-level' as const,
  title: 'Relative level in one sweep (dB)',
  appliesTo: 'Carrier and unwanted-sideband suppression, IMD, mask and spurious margins in dBc',
  note:
    `${EXAMPLE_NOTE} Absolute-level terms cancel when both readings come from one sweep; ` +
    'drop the RBW row when both readings use the same RBW.',
  contributions: Object.freeze([
    {
      name: 'Scale fidelity over the level difference (example)',
      distribution: 'rectangular' as const,
      value: 0.3,
    },
    {
      name: 'RBW switching, if the RBW changes (example)',
      distribution: 'rectangular' as const,
      value: 0.1,
    },
    {
      name: 'Repeatability, standard deviation (example)',
      distribution: 'normal' as const,
      value: 0.1,
      coverageFactor: 1,
    },
  ]),
});

/** Both templates, for pickers. */
export const BUDGET_TEMPLATES: readonly BudgetTemplate[] = Object.freeze([
  ABSOLUTE_LEVEL_BUDGET_TEMPLATE,
  RELATIVE_LEVEL_BUDGET_TEMPLATE,
]);
