/**
 * From a test case's readings and its rule set to a result with margin, uncertainty and verdict.
 * Pure: the browser calls it as values are typed, the server calls it on save and stores what it
 * returns, with ENGINE_VERSION.
 */
import type { RuleSetBody } from '../rules/rule-set';
import type { TestKind } from '../rules/test-kind';
import { carrierSuppressionDb } from '../measurements/carrier-suppression';
import { combineUncertainty, type UncertaintyContribution } from '../uncertainty/combine-uncertainty';
import { applyDecisionRule, describeDecisionRule } from '../uncertainty/decision-rule';
import type { TestCaseResult } from './test-case-result';
import { READING_FIELDS, type ReadingValues } from './reading-fields';

export class EvaluationError extends Error {}

interface Measured {
  value: number;
  unit: string;
  limit: number;
  limitText: string;
  direction: 'at-least' | 'at-most';
  detail: TestCaseResult['detail'];
  relative: boolean;
}

function need(readings: ReadingValues, kind: TestKind): void {
  for (const field of READING_FIELDS[kind]) {
    const v = readings[field.key];
    if (!field.optional && (typeof v !== 'number' || !Number.isFinite(v))) {
      throw new EvaluationError(`${field.label} is required and must be a finite number.`);
    }
  }
}

function measure(kind: TestKind, readings: ReadingValues, rules: RuleSetBody): Measured {
  switch (kind) {
    case 'carrier-suppression': {
      const limit = rules.limits.carrierSuppression;
      if (!limit) throw new EvaluationError('The rule set has no carrier-suppression limit.');
      const value = carrierSuppressionDb({ pepDbm: readings.pepDbm as number, carrierDbm: readings.carrierDbm as number });
      return {
        value,
        unit: 'dB below PEP',
        limit: limit.minDbBelowPep,
        limitText: `at least ${limit.minDbBelowPep} dB below PEP (${limit.source})`,
        direction: 'at-least',
        detail: { pepDbm: readings.pepDbm as number, carrierDbm: readings.carrierDbm as number },
        relative: true,
      };
    }
    default:
      throw new EvaluationError(`Evaluation of ${kind} from hand readings is not available yet.`);
  }
}

export function evaluateTestCase(input: {
  kind: TestKind;
  readings: ReadingValues;
  rules: RuleSetBody;
  /** Extra contributions from the instruments used (their calibration certificates). */
  instrumentContributions?: UncertaintyContribution[];
}): TestCaseResult {
  need(input.readings, input.kind);
  const m = measure(input.kind, input.readings, input.rules);
  const budget = [...(m.relative ? input.rules.uncertainty.relative : input.rules.uncertainty.absolute), ...(input.instrumentContributions ?? [])];
  const uncertainty = combineUncertainty(budget, { coverageFactor: 2 });
  const decision = applyDecisionRule({
    value: m.value,
    limit: m.limit,
    direction: m.direction,
    expandedUncertainty: uncertainty.expanded,
    rule: input.rules.decisionRule,
  });
  return {
    kind: input.kind,
    value: m.value,
    unit: m.unit,
    limit: m.limit,
    limitText: m.limitText,
    direction: m.direction,
    marginDb: decision.marginDb,
    uncertainty,
    verdict: decision.verdict,
    decisionRuleText: describeDecisionRule(input.rules.decisionRule),
    detail: m.detail,
  };
}
