/**
 * Summary of a report's results per test: the worst verdict over the test's points and the least
 * margin, plus the overall verdict. "Worst" ranks Fail over Conditional fail over Conditional pass
 * over Pass (ILAC-G8:09/2019 terms); points not evaluated do not change an evaluated test's
 * verdict, and a test with no evaluated point is "not evaluated".
 */
import { defaultDecimals, formatNumber } from '../pdf-kit/format-number';
import type { ReportResult, ReportVerdict } from './report-document';
import { differenceUnit } from './result-row';

const SEVERITY: Readonly<Record<ReportVerdict, number>> = {
  'not-evaluated': 0,
  pass: 1,
  'conditional-pass': 2,
  'conditional-fail': 3,
  fail: 4,
};

export interface TestVerdictSummary {
  testName: string;
  verdict: ReportVerdict;
  testPointCount: number;
  /** Smallest margin over the test's points, with its unit; null when no point has one. */
  leastMargin: { value: number; unit: string } | null;
}

/** The worse of two verdicts by the ranking above. */
export function worseVerdict(a: ReportVerdict, b: ReportVerdict): ReportVerdict {
  return SEVERITY[b] > SEVERITY[a] ? b : a;
}

/**
 * One summary per test name, in order of first appearance.
 * @example summariseVerdicts([{ testName: 'A', verdict: 'pass', ... },
 *   { testName: 'A', verdict: 'fail', ... }])
 *   // [{ testName: 'A', verdict: 'fail', testPointCount: 2, leastMargin: ... }]
 */
export function summariseVerdicts(results: readonly ReportResult[]): TestVerdictSummary[] {
  const byName = new Map<string, TestVerdictSummary>();
  for (const r of results) {
    const entry = byName.get(r.testName) ?? {
      testName: r.testName,
      verdict: 'not-evaluated',
      testPointCount: 0,
      leastMargin: null,
    };
    entry.verdict = worseVerdict(entry.verdict, r.verdict);
    entry.testPointCount += 1;
    const margin = r.margin ?? Number.NaN;
    const smaller = entry.leastMargin === null || margin < entry.leastMargin.value;
    if (Number.isFinite(margin) && smaller) entry.leastMargin = { value: margin, unit: r.unit };
    byName.set(r.testName, entry);
  }
  return [...byName.values()];
}

/**
 * The worst verdict over all results; "not-evaluated" only when nothing was evaluated (or the
 * list is empty).
 * @example overallVerdict([{ verdict: 'pass' }, { verdict: 'conditional-pass' }])
 *   // 'conditional-pass'
 */
export function overallVerdict(results: readonly Pick<ReportResult, 'verdict'>[]): ReportVerdict {
  return results.reduce<ReportVerdict>(
    (worst, r) => worseVerdict(worst, r.verdict),
    'not-evaluated',
  );
}

/**
 * A least margin as printed: signed, with the difference unit ("dB re PEP" margins are dB), or an
 * em dash without a margin.
 * @example formatLeastMargin({ value: 4.85, unit: 'dB re PEP' }) // '+4.85 dB'
 */
export function formatLeastMargin(margin: TestVerdictSummary['leastMargin']): string {
  if (margin === null) return '\u2014';
  const value = formatNumber(margin.value, defaultDecimals(margin.value), { signed: true });
  return `${value} ${differenceUnit(margin.unit)}`;
}
