/**
 * Printed as "Decision rule": the rule applied (ISO/IEC 17025:2017 7.8.6), the meaning of the
 * verdict words (ILAC-G8:09/2019) and how uncertainty is stated (JCGM 100:2008).
 */
import type { ReportSection } from '../report-section';

export const decisionRuleSection: ReportSection = {
  id: 'decision-rule',
  render(ctx, report) {
    ctx.heading('Decision rule and uncertainty');
    ctx.paragraph(report.decisionRule);
    ctx.paragraph(
      'Verdicts use the terms of ILAC-G8:09/2019. Pass: the value is inside the limit by at ' +
        'least the guard band. Conditional pass: the value is inside the limit by less than the ' +
        'guard band. Conditional fail: the value is outside the limit by less than the guard ' +
        'band. Fail: the value is outside the limit by at least the guard band. Not evaluated: ' +
        'no limit applies or no value was obtained.',
    );
    ctx.paragraph(
      'The expanded uncertainty U is the standard uncertainty multiplied by the coverage factor ' +
        'k stated with it; for k = 2 and a normal distribution the coverage probability is ' +
        'approximately 95 % (JCGM 100:2008).',
    );
  },
};
