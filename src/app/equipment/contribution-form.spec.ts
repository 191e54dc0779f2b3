import { FormBuilder } from '@angular/forms';
import { contributionBody, contributionGroup, contributionStandard } from './contribution-form';

const row = (over: Partial<ReturnType<ReturnType<typeof contributionGroup>['getRawValue']>>) => ({
  name: ' Analyzer ',
  budget: 'relative' as const,
  distribution: 'rectangular' as const,
  value: 1,
  coverageFactor: 2,
  sensitivity: 1,
  ...over,
});

describe('contribution rows of the instrument form', () => {
  it('sends the coverage factor only for a normal distribution and the sensitivity only when not 1', () => {
    expect(contributionBody(row({}))).toEqual({ name: 'Analyzer', budget: 'relative', distribution: 'rectangular', value: 1 });
    expect(contributionBody(row({ distribution: 'normal', coverageFactor: 2, sensitivity: -0.5 }))).toEqual({ name: 'Analyzer', budget: 'relative', distribution: 'normal', value: 1, coverageFactor: 2, sensitivity: -0.5 });
  });

  // GUM JCGM 100:2008 §4.3.7: rectangular ±a → a/√3; a certificate's U with k = 2 → U/2; U-shaped ±a → a/√2 (common practice for mismatch).
  it.each([
    [row({ value: 1 }), 1 / Math.sqrt(3)],
    [row({ distribution: 'normal', value: 0.2, coverageFactor: 2 }), 0.1],
    [row({ distribution: 'u-shaped', value: 0.17 }), 0.17 / Math.SQRT2],
    [row({ distribution: 'triangular', value: 0.6, sensitivity: -2 }), (2 * 0.6) / Math.sqrt(6)],
  ])('standard uncertainty of %j', (v, expected) => {
    expect(contributionStandard(v)).toBeCloseTo(expected, 12);
  });

  it('gives null instead of throwing while a value cannot be evaluated', () => {
    expect(contributionStandard(row({ value: -1 }))).toBeNull();
    expect(contributionStandard(row({ distribution: 'normal', coverageFactor: 0 }))).toBeNull();
  });

  it('fills a group from a stored contribution', () => {
    const g = contributionGroup(new FormBuilder(), { name: 'Cal', budget: 'absolute', distribution: 'normal', value: 0.3, coverageFactor: 2 });
    expect(g.getRawValue()).toEqual({ name: 'Cal', budget: 'absolute', distribution: 'normal', value: 0.3, coverageFactor: 2, sensitivity: 1 });
    expect(g.valid).toBe(true);
  });
});
