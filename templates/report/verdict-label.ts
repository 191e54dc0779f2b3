/**
 * Verdict words as printed. The four conformity terms are those of ILAC-G8:09/2019 for a
 * non-binary decision rule; the word always appears, colour only reinforces it.
 */
import type { Theme } from '../pdf-kit/theme';
import type { ReportVerdict } from './report-document';

export const VERDICT_LABELS: Readonly<Record<ReportVerdict, string>> = {
  pass: 'Pass',
  'conditional-pass': 'Conditional pass',
  'conditional-fail': 'Conditional fail',
  fail: 'Fail',
  'not-evaluated': 'Not evaluated',
};

/**
 * The printed word for a verdict. An unknown verdict throws a RangeError (a report must never
 * print a blank or invented verdict).
 * @example verdictLabel('conditional-pass') // 'Conditional pass'
 */
export function verdictLabel(verdict: ReportVerdict): string {
  const label = VERDICT_LABELS[verdict];
  if (label === undefined) {
    throw new RangeError(`verdictLabel: unknown verdict "${String(verdict)}"`);
  }
  return label;
}

/** The theme colour that accompanies the verdict word. */
export function verdictColor(verdict: ReportVerdict, theme: Theme): string {
  switch (verdict) {
    case 'pass':
      return theme.colors.pass;
    case 'conditional-pass':
    case 'conditional-fail':
      return theme.colors.conditional;
    case 'fail':
      return theme.colors.fail;
    default:
      return theme.colors.muted;
  }
}
