import type { ReportResult, ReportVerdict } from './report-document';
import { overallVerdict, summariseVerdicts, worseVerdict } from './summarise-verdicts';

const row = (
  testName: string,
  verdict: ReportVerdict,
  margin: number | null = null,
  unit = 'dB',
): ReportResult => ({
  testName,
  testPoint: 'p',
  value: null,
  unit,
  limit: '',
  margin,
  expandedUncertainty: null,
  coverageFactor: null,
  verdict,
});

describe('summariseVerdicts', () => {
  // ILAC-G8:09/2019 non-binary terms, from best to worst: Pass, Conditional pass, Conditional
  // fail, Fail. A test is only as good as its worst point (common practice for a summary).
  it.each<[ReportVerdict[], ReportVerdict]>([
    [['pass', 'pass'], 'pass'],
    [['pass', 'conditional-pass'], 'conditional-pass'],
    [['conditional-pass', 'conditional-fail'], 'conditional-fail'],
    [['conditional-fail', 'fail', 'pass'], 'fail'],
    [['not-evaluated', 'pass'], 'pass'],
    [['not-evaluated'], 'not-evaluated'],
  ])('points %p -> %p', (verdicts, expected) => {
    expect(summariseVerdicts(verdicts.map((v) => row('T', v)))[0].verdict).toBe(expected);
    expect(overallVerdict(verdicts.map((v) => ({ verdict: v })))).toBe(expected);
  });

  it('keeps the order of first appearance, counts points and finds the least margin', () => {
    const s = summariseVerdicts([
      row('B', 'pass', 3.2),
      row('A', 'pass', 6),
      row('B', 'conditional-fail', -0.4),
      row('B', 'pass', null),
    ]);
    expect(s.map((t) => t.testName)).toEqual(['B', 'A']);
    expect(s[0]).toEqual({
      testName: 'B',
      verdict: 'conditional-fail',
      testPointCount: 3,
      leastMargin: { value: -0.4, unit: 'dB' },
    });
    expect(s[1].leastMargin).toEqual({ value: 6, unit: 'dB' });
  });

  it('treats an empty list as not evaluated', () => {
    expect(summariseVerdicts([])).toEqual([]);
    expect(overallVerdict([])).toBe('not-evaluated');
  });

  it('is symmetric in its pairwise ranking', () => {
    const all: ReportVerdict[] = [
      'not-evaluated',
      'pass',
      'conditional-pass',
      'conditional-fail',
      'fail',
    ];
    for (const a of all) for (const b of all) expect(worseVerdict(a, b)).toBe(worseVerdict(b, a));
  });
});
