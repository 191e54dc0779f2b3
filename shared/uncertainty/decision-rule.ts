import { requireFinite, requireNonNegative } from '../units/number-guards';

/** Outcome of a conformity decision (ILAC-G8:09/2019 §4.2). */
export type Verdict = 'pass' | 'conditional-pass' | 'conditional-fail' | 'fail';

/** 'at-least': the value must be ≥ the limit (e.g. suppression ≥ 40 dB); 'at-most': ≤ the limit. */
export type LimitDirection = 'at-least' | 'at-most';

/** Guard band w: the expanded uncertainty U of the result, or a fixed figure (value's unit). */
export type GuardBand = 'expanded-uncertainty' | number;

export type DecisionRule =
  | { kind: 'simple-acceptance' }
  | { kind: 'binary-guard-band'; guardBand: GuardBand }
  | { kind: 'non-binary'; guardBand: GuardBand };

export interface Decision {
  verdict: Verdict;
  /** value − limit (at-least) or limit − value (at-most); positive is inside the limit. */
  marginDb: number;
  /** Guard band w applied, same unit as the value. */
  guardBandDb: number;
  /** Where a 'pass' starts: limit + w (at-least) or limit − w (at-most). */
  acceptanceLimit: number;
}

/** The guard band a rule implies: 0 for simple acceptance, else U or the fixed figure. */
export function guardBandOf(
  fnName: string,
  rule: DecisionRule,
  expandedUncertainty: number,
): number {
  if (rule.kind === 'simple-acceptance') return 0;
  if (rule.guardBand === 'expanded-uncertainty') return expandedUncertainty;
  return requireNonNegative(fnName, 'guardBand', rule.guardBand);
}

/**
 * Applies a decision rule to a measured value against a tolerance limit TL with guard band w.
 * With margin m = v − TL (at-least) or TL − v (at-most):
 * - simple acceptance (w = 0): pass when m ≥ 0, else fail;
 * - binary guard band: pass only when m ≥ w, else fail;
 * - non-binary: pass m ≥ w; conditional pass 0 ≤ m < w; conditional fail −w < m < 0;
 *   fail m ≤ −w.
 *
 * Source: ILAC-G8:09/2019 §4.2 (simple acceptance, binary and non-binary statements with a guard
 * band, usually w = U), in our words. Check: TL 40 dB, U 1.21 dB, values 41.0/39.5/38.5/41.5 →
 * simple P/F/F/P; binary w = U F/F/F/P; non-binary CP/CF/F/P.
 * Units: any, consistent (dB for most of our quantities). Domain: value, limit finite;
 * expandedUncertainty ≥ 0; a fixed guard band ≥ 0.
 * Bad input: RangeError starting with the function name.
 *
 * @example
 * applyDecisionRule({ value: 41, limit: 40, direction: 'at-least', expandedUncertainty: 1.21,
 *   rule: { kind: 'non-binary', guardBand: 'expanded-uncertainty' } });
 * // { verdict: 'conditional-pass', marginDb: 1, guardBandDb: 1.21, acceptanceLimit: 41.21 }
 */
export function applyDecisionRule(input: {
  value: number;
  limit: number;
  direction: LimitDirection;
  expandedUncertainty: number;
  rule: DecisionRule;
}): Decision {
  const fn = 'applyDecisionRule';
  const value = requireFinite(fn, 'value', input.value);
  const limit = requireFinite(fn, 'limit', input.limit);
  const u = requireNonNegative(fn, 'expandedUncertainty', input.expandedUncertainty);
  const { direction, rule } = input;
  if (direction !== 'at-least' && direction !== 'at-most') {
    throw new RangeError(`${fn}: direction must be 'at-least' or 'at-most'`);
  }
  const kinds = ['simple-acceptance', 'binary-guard-band', 'non-binary'];
  if (!rule || !kinds.includes(rule.kind)) throw new RangeError(`${fn}: unknown rule kind`);
  const w = guardBandOf(fn, rule, u);
  const marginDb = direction === 'at-least' ? value - limit : limit - value;
  const acceptanceLimit = direction === 'at-least' ? limit + w : limit - w;
  let verdict: Verdict;
  if (marginDb >= w) verdict = 'pass';
  else if (rule.kind !== 'non-binary') verdict = 'fail';
  else if (marginDb >= 0) verdict = 'conditional-pass';
  else if (marginDb > -w) verdict = 'conditional-fail';
  else verdict = 'fail';
  return { verdict, marginDb, guardBandDb: w, acceptanceLimit };
}
