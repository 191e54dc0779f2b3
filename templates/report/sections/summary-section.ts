/**
 * Printed on page 1 after the title block: the overall verdict and the worst verdict per test,
 * so a reader sees the outcome before the detail.
 */
import { drawTable } from '../../pdf-kit/table';
import type { ReportSection } from '../report-section';
import { formatLeastMargin, overallVerdict, summariseVerdicts } from '../summarise-verdicts';
import { verdictColor, verdictLabel } from '../verdict-label';

export const summarySection: ReportSection = {
  id: 'summary',
  render(ctx, report) {
    ctx.heading('Summary of results');
    const overall = overallVerdict(report.results);
    ctx.ensureSpace(40);
    const y = ctx.y;
    ctx.text('Overall verdict:', { font: 'medium', yPt: y });
    ctx.text(verdictLabel(overall), {
      font: 'bold',
      color: verdictColor(overall, ctx.theme),
      xPt: ctx.frame.leftPt + 82,
      yPt: y,
    });
    ctx.gap(6);
    const summaries = summariseVerdicts(report.results);
    drawTable(ctx, {
      columns: [
        { header: 'Test', widthWeight: 3 },
        { header: 'Test points', widthWeight: 1, align: 'right' },
        { header: 'Least margin', widthWeight: 1.5, align: 'right' },
        { header: 'Verdict', widthWeight: 1.5 },
      ],
      rows: summaries.map((s) => [
        s.testName,
        String(s.testPointCount),
        formatLeastMargin(s.leastMargin),
        verdictLabel(s.verdict),
      ]),
      cellStyle: (row, col) =>
        col === 3
          ? { font: 'medium', color: verdictColor(summaries[row].verdict, ctx.theme) }
          : undefined,
    });
  },
};
