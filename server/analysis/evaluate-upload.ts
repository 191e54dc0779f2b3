import { EvaluationError, type Budget } from '../../shared/evaluation/evaluate-test-case';
import { evaluateTrace, type TraceEvaluation, type UploadEvidence } from '../../shared/evaluation/evaluate-trace';
import type { RuleSetBody } from '../../shared/rules/rule-set';
import type { TestKind } from '../../shared/rules/test-kind';
import type { UncertaintyContribution } from '../../shared/uncertainty/uncertainty-contribution';
import { notEvaluable } from '../uploads/upload-problems';
import type { UploadSummary } from './analyse-upload';
import { maskLimitLine } from './mask-limit-line';

/** The instrument facts a result keeps, as saved readings keep them (server/runs/run-service.ts). */
export interface InstrumentRecord {
  id: string;
  name: string;
  serialNumber: string;
  calibrationDue: string;
  certificateRef: string;
}

/**
 * Judges an analysed upload against the rule set (shared evaluateTrace). What the engine cannot
 * judge — the wrong kind of evidence for the case, a missing reference level, a rule set without
 * the limit or budget, a trace with no point outside the exempt band — is a 422 'not-evaluable'.
 */
export function evaluateUpload(input: { kind: TestKind; evidence: UploadEvidence; rules: RuleSetBody; contributions?: Partial<Record<Budget, UncertaintyContribution[]>> }): TraceEvaluation {
  try {
    return evaluateTrace({ kind: input.kind, evidence: input.evidence, rules: input.rules, instrumentContributions: input.contributions });
  } catch (error) {
    if (error instanceof EvaluationError || error instanceof RangeError) throw notEvaluable(error.message);
    throw error;
  }
}

/**
 * The `detail` of a result computed from an upload: the same members a result from a reading has
 * (limit text, decision rule, budget, inputs, instruments), plus where the figures came from,
 * the mask check with the limit line for the chart, and the phasing diagnosis when there is one.
 */
export function uploadResultDetail(e: TraceEvaluation, context: { summary: UploadSummary; rules: RuleSetBody; instruments: InstrumentRecord[] }): Record<string, unknown> {
  const mask = context.rules.limits.emissionMask;
  const span = context.summary.source === 'trace' ? Math.max(Math.abs(context.summary.stopHz - (e.mask?.assignedHz ?? 0)), Math.abs(context.summary.startHz - (e.mask?.assignedHz ?? 0))) : 0;
  return {
    source: context.summary.source,
    limitText: e.limitText,
    direction: e.direction,
    decisionRuleText: e.decisionRuleText,
    budget: e.uncertainty.rows,
    combinedStandard: e.uncertainty.combinedStandard,
    inputs: e.detail,
    instruments: context.instruments,
    ...(e.mask && { mask: e.mask }),
    ...(e.mask && mask && { limitLine: maskLimitLine(mask, e.mask.assignedHz, e.mask.referenceDbm, span) }),
    ...(e.phasing && { phasing: e.phasing }),
  };
}
