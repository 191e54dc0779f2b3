import type { DecisionRule } from './decision-rule';

function guardBandText(guardBand: 'expanded-uncertainty' | number): string {
  return guardBand === 'expanded-uncertainty'
    ? 'w = U, the expanded uncertainty of each result'
    : `w = ${guardBand} (fixed)`;
}

/**
 * A sentence stating the decision rule for a report (ISO/IEC 17025:2017 7.8.6 asks that the
 * rule be stated with the results it applies to). Wording is ours; clause numbers refer to
 * ILAC-G8:09/2019.
 * Bad input: an unknown rule kind → RangeError starting with the function name.
 *
 * @example describeDecisionRule({ kind: 'simple-acceptance' });
 * // 'Simple acceptance (ILAC-G8:09/2019 4.2.1, w = 0): a result passes when it is on the …'
 */
export function describeDecisionRule(rule: DecisionRule): string {
  switch (rule?.kind) {
    case 'simple-acceptance':
      return (
        'Simple acceptance (ILAC-G8:09/2019 4.2.1, w = 0): a result passes when it is on the ' +
        'permitted side of the limit or on it, and fails otherwise; the measurement uncertainty ' +
        'is reported but not used to shift the limit.'
      );
    case 'binary-guard-band':
      return (
        'Binary statement with guard band ' +
        `(ILAC-G8:09/2019 4.2.2, ${guardBandText(rule.guardBand)}): ` +
        'a result passes only when it lies at least w inside the limit; every other result fails.'
      );
    case 'non-binary':
      return (
        'Non-binary statement with guard band ' +
        `(ILAC-G8:09/2019 4.2.3, ${guardBandText(rule.guardBand)}): ` +
        'pass at least w inside the limit; conditional pass inside the limit by less than w; ' +
        'conditional fail outside the limit by less than w; fail at w or more outside the limit.'
      );
    default:
      throw new RangeError('describeDecisionRule: unknown rule kind');
  }
}
