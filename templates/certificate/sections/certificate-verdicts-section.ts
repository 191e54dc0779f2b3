/**
 * Printed as the verdict per test with the least margin, then the overall verdict in words and
 * the decision rule it rests on (ISO/IEC 17025:2017 7.8.6).
 */
import { drawTable } from '../../pdf-kit/table';
import { formatLeastMargin } from '../../report/summarise-verdicts';
import { verdictColor, verdictLabel } from '../../report/verdict-label';
import type { CertificateSection } from '../certificate-section';

export const certificateVerdictsSection: CertificateSection = {
  id: 'verdicts',
  render(ctx, cert) {
    const { theme } = ctx;
    ctx.subheading('Results');
    drawTable(ctx, {
      columns: [
        { header: 'Test', widthWeight: 3 },
        { header: 'Test points', widthWeight: 1, align: 'right' },
        { header: 'Least margin', widthWeight: 1.4, align: 'right' },
        { header: 'Verdict', widthWeight: 1.5 },
      ],
      rows: cert.tests.map((t) => [
        t.testName,
        String(t.testPointCount),
        formatLeastMargin(t.leastMargin),
        verdictLabel(t.verdict),
      ]),
      cellStyle: (row, col) =>
        col === 3
          ? { font: 'medium', color: verdictColor(cert.tests[row].verdict, theme) }
          : undefined,
      sizePt: theme.sizesPt.body - 0.5,
    });
    ctx.ensureSpace(60);
    const y = ctx.y;
    ctx.text('Overall verdict:', { font: 'medium', sizePt: 12, yPt: y });
    ctx.text(verdictLabel(cert.overallVerdict), {
      font: 'bold',
      sizePt: 12,
      color: verdictColor(cert.overallVerdict, theme),
      xPt: ctx.frame.leftPt + 100,
      yPt: y,
    });
    ctx.gap(6);
    const note = { sizePt: theme.sizesPt.small, color: theme.colors.muted };
    ctx.paragraph(`Decision rule: ${cert.decisionRule}`, note);
    ctx.paragraph(
      'This certificate relates only to the item tested and does not imply approval by any regulator.',
      note,
    );
  },
};
