/** Printed last: a clear end-of-report mark with the number (ISO/IEC 17025:2017 7.8.2.1 d). */
import type { ReportSection } from '../report-section';

export const END_OF_REPORT_TEXT = 'End of report';

export const endOfReportSection: ReportSection = {
  id: 'end-of-report',
  render(ctx, report) {
    const { doc, frame, theme } = ctx;
    ctx.ensureSpace(40);
    ctx.gap(14);
    const y = ctx.y + 5;
    const label = `${END_OF_REPORT_TEXT} ${report.reportNumber}`;
    doc.font('medium').fontSize(theme.sizesPt.small);
    const w = doc.widthOfString(label) + 20;
    const mid = frame.leftPt + frame.widthPt / 2;
    doc.moveTo(frame.leftPt + 60, y).lineTo(mid - w / 2, y);
    doc.moveTo(mid + w / 2, y).lineTo(frame.rightPt - 60, y);
    doc.lineWidth(0.6).strokeColor(theme.colors.accent).stroke();
    ctx.text(label, {
      font: 'medium',
      sizePt: theme.sizesPt.small,
      color: theme.colors.accent,
      xPt: mid - w / 2,
      yPt: y - 4.5,
      widthPt: w,
      align: 'center',
    });
  },
};
