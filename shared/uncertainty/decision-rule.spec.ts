import fc from 'fast-check';
import { applyDecisionRule } from './decision-rule';
import type { DecisionRule, LimitDirection, Verdict } from './decision-rule';
import { describeDecisionRule } from './describe-decision-rule';

const simple: DecisionRule = { kind: 'simple-acceptance' };
const binary: DecisionRule = { kind: 'binary-guard-band', guardBand: 'expanded-uncertainty' };
const nonBinary: DecisionRule = { kind: 'non-binary', guardBand: 'expanded-uncertainty' };

function verdictOf(
  value: number,
  rule: DecisionRule,
  direction: LimitDirection = 'at-least',
  limit = 40,
): Verdict {
  return applyDecisionRule({ value, limit, direction, expandedUncertainty: 1.21, rule }).verdict;
}

describe('applyDecisionRule (ILAC-G8:09/2019 §4.2)', () => {
  // Worked check (common practice, ILAC-G8 rules): TL 40 dB "at least", U 1.21 dB
  const values = [41.0, 39.5, 38.5, 41.5];

  it('simple acceptance: P/F/F/P', () => {
    expect(values.map((v) => verdictOf(v, simple))).toEqual(['pass', 'fail', 'fail', 'pass']);
  });

  it('binary guard band w = U: F/F/F/P', () => {
    expect(values.map((v) => verdictOf(v, binary))).toEqual(['fail', 'fail', 'fail', 'pass']);
  });

  it('non-binary w = U: CP/CF/F/P', () => {
    expect(values.map((v) => verdictOf(v, nonBinary))).toEqual([
      'conditional-pass',
      'conditional-fail',
      'fail',
      'pass',
    ]);
  });

  it('mirrors for an upper limit ("at most")', () => {
    // spurious level at most −13 dBm, U 1.21: −14.0 / −12.5 / −11.5 / −14.5
    const readings = [-14.0, -12.5, -11.5, -14.5];
    const atMost = readings.map((v) => verdictOf(v, nonBinary, 'at-most', -13));
    expect(atMost).toEqual(['conditional-pass', 'conditional-fail', 'fail', 'pass']);
  });

  it('reports margin, guard band and acceptance limit', () => {
    const atLeast = { limit: 40, direction: 'at-least' as const, expandedUncertainty: 1.21 };
    expect(applyDecisionRule({ ...atLeast, value: 41, rule: nonBinary })).toEqual({
      verdict: 'conditional-pass',
      marginDb: 1,
      guardBandDb: 1.21,
      acceptanceLimit: 41.21,
    });
    const atMost = { limit: -13, direction: 'at-most' as const, expandedUncertainty: 1.21 };
    expect(applyDecisionRule({ ...atMost, value: -14, rule: binary })).toMatchObject({
      marginDb: 1,
      acceptanceLimit: -14.21,
    });
    expect(applyDecisionRule({ ...atLeast, value: 41, rule: simple })).toMatchObject({
      guardBandDb: 0,
      acceptanceLimit: 40,
    });
  });

  it('boundaries: on the limit passes (simple) or conditionally passes; at TL − w fails', () => {
    expect(verdictOf(40, simple)).toBe('pass');
    expect(verdictOf(40, nonBinary)).toBe('conditional-pass');
    const wide = { limit: 40, direction: 'at-least' as const, expandedUncertainty: 2 };
    expect(applyDecisionRule({ ...wide, value: 38, rule: nonBinary }).verdict).toBe('fail');
    expect(applyDecisionRule({ ...wide, value: 42, rule: binary }).verdict).toBe('pass');
  });

  it('a fixed guard band overrides U', () => {
    const rule: DecisionRule = { kind: 'binary-guard-band', guardBand: 0.5 };
    const input = { value: 40.6, limit: 40, direction: 'at-least' as const };
    const u = { expandedUncertainty: 3 };
    expect(applyDecisionRule({ ...input, ...u, rule })).toMatchObject({
      verdict: 'pass',
      guardBandDb: 0.5,
    });
  });

  it('is monotonic in the value for every rule and direction (property, seeded)', () => {
    const rank: Record<Verdict, number> = {
      fail: 0,
      'conditional-fail': 1,
      'conditional-pass': 2,
      pass: 3,
    };
    const rules: DecisionRule[] = [
      simple,
      binary,
      nonBinary,
      { kind: 'non-binary', guardBand: 0.7 },
    ];
    fc.assert(
      fc.property(
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: -100, max: 100, noNaN: true }),
        fc.double({ min: 0, max: 10, noNaN: true }),
        fc.integer({ min: 0, max: 3 }),
        fc.boolean(),
        (a, b, limit, expandedUncertainty, ruleIndex, atLeast) => {
          const [low, high] = a <= b ? [a, b] : [b, a];
          const direction: LimitDirection = atLeast ? 'at-least' : 'at-most';
          const common = { limit, direction, expandedUncertainty, rule: rules[ruleIndex] };
          const vLow = rank[applyDecisionRule({ ...common, value: low }).verdict];
          const vHigh = rank[applyDecisionRule({ ...common, value: high }).verdict];
          if (atLeast) expect(vHigh).toBeGreaterThanOrEqual(vLow);
          else expect(vHigh).toBeLessThanOrEqual(vLow);
        },
      ),
      { seed: 809, numRuns: 1000 },
    );
  });

  it('throws with the function name on bad input', () => {
    const base = {
      value: 1,
      limit: 0,
      direction: 'at-least' as const,
      expandedUncertainty: 1,
      rule: simple,
    };
    expect(() => applyDecisionRule({ ...base, value: NaN })).toThrow(/^applyDecisionRule: value/);
    expect(() => applyDecisionRule({ ...base, limit: Infinity })).toThrow(/limit/);
    expect(() => applyDecisionRule({ ...base, expandedUncertainty: -1 })).toThrow(
      /expandedUncertainty/,
    );
    expect(() => applyDecisionRule({ ...base, direction: 'equal' as LimitDirection })).toThrow(
      /direction/,
    );
    expect(
      () => applyDecisionRule({ ...base, rule: { kind: 'other' } as unknown as DecisionRule }),
    ).toThrow(/unknown rule/);
    expect(
      () => applyDecisionRule({ ...base, rule: { kind: 'non-binary', guardBand: -1 } }),
    ).toThrow(/guardBand/);
  });
});

describe('describeDecisionRule', () => {
  it('states each rule with its ILAC-G8 clause', () => {
    expect(describeDecisionRule(simple)).toMatch(
      /^Simple acceptance \(ILAC-G8:09\/2019 4\.2\.1, w = 0\)/,
    );
    expect(describeDecisionRule(binary)).toMatch(/4\.2\.2, w = U/);
    expect(describeDecisionRule(nonBinary)).toMatch(/4\.2\.3.*conditional pass.*conditional fail/);
    expect(describeDecisionRule({ kind: 'non-binary', guardBand: 0.5 })).toMatch(
      /w = 0\.5 \(fixed\)/,
    );
  });

  it('throws on an unknown rule', () => {
    expect(() => describeDecisionRule({ kind: 'x' } as unknown as DecisionRule)).toThrow(
      /^describeDecisionRule: /,
    );
  });
});
