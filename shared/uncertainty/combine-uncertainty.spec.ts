import {
  ABSOLUTE_LEVEL_BUDGET_TEMPLATE,
  BUDGET_TEMPLATES,
  RELATIVE_LEVEL_BUDGET_TEMPLATE,
} from './budget-templates';
import { combineUncertainty } from './combine-uncertainty';
import { standardUncertainty } from './uncertainty-contribution';
import type { UncertaintyContribution } from './uncertainty-contribution';

describe('standardUncertainty (GUM JCGM 100:2008 §4.3)', () => {
  it.each([
    // [distribution, value, k, standard] — a/√3, a/√2, a/√6 (from memory for the triangular), U/k
    ['rectangular', 1, undefined, 0.5773502691896258],
    ['u-shaped', 1, undefined, 0.7071067811865476],
    ['triangular', 1, undefined, 0.408248290463863],
    ['normal', 0.2, undefined, 0.1],
    ['normal', 0.3, 3, 0.1],
    ['normal', 0.1, 1, 0.1],
  ] as const)('%s %p (k %p) → %p', (distribution, value, coverageFactor, standard) => {
    expect(standardUncertainty({ name: 'x', distribution, value, coverageFactor })).toBeCloseTo(
      standard,
      12,
    );
  });

  it('throws on a negative half-width, a zero k or an unknown distribution', () => {
    expect(
      () => standardUncertainty({ name: 'x', distribution: 'rectangular', value: -1 }),
    ).toThrow(/^standardUncertainty: value/);
    expect(
      () => standardUncertainty({ name: 'x', distribution: 'normal', value: 1, coverageFactor: 0 }),
    ).toThrow(/coverageFactor/);
    expect(() =>
      standardUncertainty({ name: 'x', distribution: 'poisson' as 'normal', value: 1 }),
    ).toThrow(/unknown distribution 'poisson'/);
  });
});

describe('combineUncertainty (GUM JCGM 100:2008 §5.1.2, root-sum-square)', () => {
  const worked: UncertaintyContribution[] = [
    { name: 'Spectrum analyzer', distribution: 'rectangular', value: 1.0 },
    { name: 'Mismatch', distribution: 'normal', value: 0.122, coverageFactor: 1 },
    { name: 'Calibration', distribution: 'normal', value: 0.2, coverageFactor: 2 },
    { name: 'Repeatability', distribution: 'normal', value: 0.1, coverageFactor: 1 },
  ];

  it('worked check: 0.577, 0.122, 0.100, 0.100 → u_c 0.607 dB, U 1.21 dB (common practice)', () => {
    const r = combineUncertainty(worked);
    expect(r.combinedStandard).toBeCloseTo(0.607, 3);
    expect(r.expanded).toBeCloseTo(1.21, 2);
    expect(r.coverageFactor).toBe(2);
    expect(r.rows.map((row) => row.standard)).toEqual([
      expect.closeTo(0.577, 3),
      expect.closeTo(0.122, 3),
      expect.closeTo(0.1, 3),
      expect.closeTo(0.1, 3),
    ]);
    expect(r.rows.reduce((s, row) => s + row.varianceShare, 0)).toBeCloseTo(1, 12);
    expect(r.rows[0].varianceShare).toBeGreaterThan(0.9);
  });

  it('applies sensitivity coefficients by magnitude and another coverage factor', () => {
    const r = combineUncertainty(
      [
        { name: 'a', distribution: 'normal', value: 3, coverageFactor: 1, sensitivity: -2 },
        { name: 'b', distribution: 'normal', value: 8, coverageFactor: 1 },
      ],
      { coverageFactor: 3 },
    );
    // √(6² + 8²) = 10 (Pythagorean triple)
    expect(r.combinedStandard).toBeCloseTo(10, 12);
    expect(r.expanded).toBeCloseTo(30, 12);
    expect(r.rows[0].contribution).toBe(6);
  });

  it('one contribution is its own combined uncertainty; all-zero gives zero', () => {
    expect(
      combineUncertainty([{ name: 'cal', distribution: 'normal', value: 0.2 }]).combinedStandard,
    ).toBeCloseTo(0.1, 15);
    const zero = combineUncertainty([{ name: 'z', distribution: 'rectangular', value: 0 }]);
    expect(zero.combinedStandard).toBe(0);
    expect(zero.rows[0].varianceShare).toBe(0);
  });

  it('does not overflow with huge values', () => {
    const r = combineUncertainty([
      { name: 'a', distribution: 'normal', value: 3e200, coverageFactor: 1 },
      { name: 'b', distribution: 'normal', value: 4e200, coverageFactor: 1 },
    ]);
    expect(r.combinedStandard / 5e200).toBeCloseTo(1, 12);
  });

  it('throws on an empty budget and bad rows', () => {
    expect(() => combineUncertainty([])).toThrow(
      /^combineUncertainty: the budget has no contributions/,
    );
    expect(() => combineUncertainty([{ name: 'a', distribution: 'normal', value: NaN }])).toThrow(
      /a\.value/,
    );
    expect(() =>
      combineUncertainty([{ name: 'a', distribution: 'normal', value: 1, sensitivity: Infinity }]),
    ).toThrow(/sensitivity/);
    expect(() => combineUncertainty(worked, { coverageFactor: -2 })).toThrow(/coverageFactor/);
    expect(() => combineUncertainty(null as unknown as UncertaintyContribution[])).toThrow(
      TypeError,
    );
  });
});

describe('budget templates', () => {
  it('the absolute template reproduces the worked check (u_c 0.607, U 1.21; common practice)', () => {
    const r = combineUncertainty([...ABSOLUTE_LEVEL_BUDGET_TEMPLATE.contributions]);
    expect(r.combinedStandard).toBeCloseTo(0.607, 3);
    expect(r.expanded).toBeCloseTo(1.21, 2);
  });

  it('the relative template has no absolute-accuracy, attenuator or mismatch rows (they cancel)', () => {
    const rows = RELATIVE_LEVEL_BUDGET_TEMPLATE.contributions;
    const names = rows.map((c) => c.name.toLowerCase()).join('|');
    expect(names).not.toMatch(/absolute|attenuator|mismatch|calibration/);
    const relative = combineUncertainty([...rows]).combinedStandard;
    const absolute = combineUncertainty([...ABSOLUTE_LEVEL_BUDGET_TEMPLATE.contributions]);
    expect(relative).toBeLessThan(absolute.combinedStandard);
  });

  it('labels every number as an example to replace', () => {
    for (const template of BUDGET_TEMPLATES) {
      expect(template.note).toMatch(/Example values only/);
      for (const c of template.contributions) expect(c.name).toMatch(/\(example\)/);
      expect(Object.isFrozen(template.contributions)).toBe(true);
    }
  });
});
