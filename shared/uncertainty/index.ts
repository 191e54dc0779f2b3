export {
  ABSOLUTE_LEVEL_BUDGET_TEMPLATE,
  BUDGET_TEMPLATES,
  RELATIVE_LEVEL_BUDGET_TEMPLATE,
} from './budget-templates';
export type { BudgetTemplate } from './budget-templates';
export { combineUncertainty } from './combine-uncertainty';
export type { UncertaintyResult, UncertaintyRow } from './combine-uncertainty';
export { applyDecisionRule } from './decision-rule';
export type { Decision, DecisionRule, GuardBand, LimitDirection, Verdict } from './decision-rule';
export { describeDecisionRule } from './describe-decision-rule';
export { falseAcceptProbability } from './false-accept-probability';
export { mismatchLimitsDb } from './mismatch-limits';
export type { MismatchLimits } from './mismatch-limits';
export { normalCdf } from './normal-cdf';
export {
  reflectionCoefficientFromVswr,
  vswrFromReflectionCoefficient,
} from './reflection-coefficient';
export { standardUncertainty } from './uncertainty-contribution';
export type { UncertaintyContribution, UncertaintyDistribution } from './uncertainty-contribution';
