import { Validators, type FormBuilder, type FormGroup, type FormControl } from '@angular/forms';
import { standardUncertainty, type UncertaintyDistribution } from '../../../shared/uncertainty/uncertainty-contribution';
import { INSTRUMENT_BUDGETS, type InstrumentBudget, type InstrumentContribution } from '../../../shared/schemas/instruments';

/** Our words for the budgets an instrument's contribution can join, with the unit of its value. */
export const BUDGET_WORDS: Record<InstrumentBudget, { label: string; unit: string }> = {
  relative: { label: 'Relative levels (dBc, dB below PEP)', unit: 'dB' },
  absolute: { label: 'Absolute levels (dBm)', unit: 'dB' },
  frequencyHz: { label: 'Frequency', unit: 'Hz' },
  bandwidthHz: { label: 'Bandwidth', unit: 'Hz' },
};
export const BUDGETS = INSTRUMENT_BUDGETS;

/** GUM JCGM 100:2008 §4.3 distributions, in words. */
export const DISTRIBUTION_WORDS: Record<UncertaintyDistribution, string> = {
  normal: 'Normal (certificate U with k)',
  rectangular: 'Rectangular (± limits)',
  'u-shaped': 'U-shaped (mismatch)',
  triangular: 'Triangular',
};

export type ContributionGroup = FormGroup<{
  name: FormControl<string>;
  budget: FormControl<InstrumentBudget>;
  distribution: FormControl<UncertaintyDistribution>;
  value: FormControl<number>;
  coverageFactor: FormControl<number>;
  sensitivity: FormControl<number>;
}>;

/** A form group for one contribution, filled from `c` (or an empty relative-level row). */
export function contributionGroup(fb: FormBuilder, c?: InstrumentContribution): ContributionGroup {
  return fb.nonNullable.group({
    name: [c?.name ?? '', [Validators.required, Validators.maxLength(200)]],
    budget: [c?.budget ?? ('relative' as InstrumentBudget), Validators.required],
    distribution: [c?.distribution ?? ('rectangular' as UncertaintyDistribution), Validators.required],
    value: [c?.value ?? 0, [Validators.required, Validators.min(0), Validators.max(1e9)]],
    coverageFactor: [c?.coverageFactor ?? 2, [Validators.min(0.01), Validators.max(10)]],
    sensitivity: [c?.sensitivity ?? 1, [Validators.min(-1e6), Validators.max(1e6)]],
  }) as ContributionGroup;
}

/**
 * The contribution as the API takes it from a row's values: the coverage factor only for a
 * normal distribution, the sensitivity only when it is not the default 1. Never throws.
 * @example contributionBody({ name: 'SA', budget: 'relative', distribution: 'rectangular', value: 0.5, coverageFactor: 2, sensitivity: 1 })
 * // { name: 'SA', budget: 'relative', distribution: 'rectangular', value: 0.5 }
 */
export function contributionBody(v: ReturnType<ContributionGroup['getRawValue']>): InstrumentContribution {
  return {
    name: v.name.trim(),
    budget: v.budget,
    distribution: v.distribution,
    value: Number(v.value),
    ...(v.distribution === 'normal' ? { coverageFactor: Number(v.coverageFactor) } : {}),
    ...(Number(v.sensitivity) !== 1 ? { sensitivity: Number(v.sensitivity) } : {}),
  };
}

/**
 * The row's standard uncertainty |c|·u (GUM §4.3 via shared standardUncertainty), or null while
 * the row cannot be evaluated (a value being typed). Never throws.
 */
export function contributionStandard(v: ReturnType<ContributionGroup['getRawValue']>): number | null {
  try {
    const c = contributionBody(v);
    const u = standardUncertainty(c) * Math.abs(c.sensitivity ?? 1);
    return Number.isFinite(u) ? u : null;
  } catch {
    return null;
  }
}
