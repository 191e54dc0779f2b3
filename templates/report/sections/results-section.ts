/**
 * Printed as "Results": every result with unit, limit, margin, expanded uncertainty with k and
 * the verdict in words (ISO/IEC 17025:2017 7.8.2.1 m, 7.8.3.1, 7.8.6), then the numbered notes.
 */
import { drawTable } from '../../pdf-kit/table';
import type { ReportSection } from '../report-section';
import { RESULT_COLUMNS, resultRowCells } from '../result-row';
import { verdictColor } from '../verdict-label';

const WEIGHTS = [1.45, 2.05, 1.05, 1.55, 0.95, 1.25, 1.05];
const NUMERIC_COLUMNS: ReadonlySet<string> = new Set(['Result', 'Margin', 'U (k)']);

export const resultsSection: ReportSection = {
  id: 'results',
  render(ctx, report) {
    ctx.heading('Results');
    ctx.paragraph(
      'The results relate only to the item tested. Margin is the distance to the limit, ' +
        'positive when the value is inside the limit. U is the expanded uncertainty with its ' +
        'coverage factor k.',
    );
    // Equal notes share one number, so a repeated remark is listed once.
    const notes: string[] = [];
    const rows = report.results.map((result) => {
      if (!result.note) return resultRowCells(result);
      let index = notes.indexOf(result.note);
      if (index < 0) index = notes.push(result.note) - 1;
      return resultRowCells(result, index + 1);
    });
    const verdictColumn = RESULT_COLUMNS.length - 1;
    drawTable(ctx, {
      columns: RESULT_COLUMNS.map((header, i) => ({
        header,
        widthWeight: WEIGHTS[i],
        align: NUMERIC_COLUMNS.has(header) ? 'right' : 'left',
      })),
      rows,
      cellStyle: (row, col) =>
        col === verdictColumn
          ? { font: 'medium', color: verdictColor(report.results[row].verdict, ctx.theme) }
          : undefined,
    });
    if (report.results.some((r) => r.externalProvider)) {
      const text = 'Results marked "external" come from the external provider named beside them.';
      ctx.paragraph(text, { sizePt: ctx.theme.sizesPt.small });
    }
    if (notes.length > 0) {
      ctx.subheading('Notes');
      const style = { sizePt: ctx.theme.sizesPt.small };
      notes.forEach((note, i) => ctx.paragraph(`[${i + 1}]  ${note}`, style));
    }
  },
};
