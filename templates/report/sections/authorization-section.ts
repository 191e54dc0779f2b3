/**
 * Printed as "Authorization": who tested, and the name, role, date and signature line of the
 * person who authorized the report (ISO/IEC 17025:2017 7.8.2.1 o). The electronic signature
 * itself is embedded in the PDF file by the server.
 */
import type { ReportPerson } from '../report-document';
import type { ReportSection } from '../report-section';
import type { RenderContext } from '../../pdf-kit/render-context';

/** "2025-03-10T14:32:00Z" -> "2025-03-10 14:32 UTC"; other strings print unchanged. */
export function formatTimestampUtc(iso: string): string {
  const match = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2})(?::\d{2}(?:\.\d+)?)?Z$/.exec(iso);
  return match ? `${match[1]} ${match[2]} UTC` : iso;
}

function personBlock(
  ctx: RenderContext,
  caption: string,
  person: ReportPerson,
  box: { xPt: number; yPt: number; widthPt: number },
): void {
  const { xPt, widthPt } = box;
  const { colors, sizesPt } = ctx.theme;
  ctx.text(caption, { font: 'medium', color: colors.muted, sizePt: sizesPt.small, ...box });
  ctx.text(person.name, { font: 'medium', xPt, widthPt });
  ctx.text(person.role, { xPt, widthPt });
}

export const authorizationSection: ReportSection = {
  id: 'authorization',
  render(ctx, report) {
    // Sign-off, verification block and end mark stay on one page (about 250 pt together).
    ctx.ensureSpace(250);
    ctx.heading('Authorization');
    const { frame, doc, theme } = ctx;
    const half = frame.widthPt / 2;
    const top = ctx.y;
    const right = { xPt: frame.leftPt + half, yPt: top, widthPt: half };
    const left = { xPt: frame.leftPt, yPt: top, widthPt: half - 12 };
    personBlock(ctx, 'Tested by', report.testedBy, left);
    personBlock(ctx, 'Authorized by', report.authorizedBy, right);
    const authorizedAt = formatTimestampUtc(report.authorizedBy.authorizedAt);
    ctx.text(`Authorized on ${authorizedAt}`, { xPt: right.xPt, widthPt: half });
    const lineY = ctx.y + 34;
    doc.moveTo(right.xPt, lineY).lineTo(frame.rightPt, lineY);
    doc.lineWidth(0.6).strokeColor(theme.colors.text).stroke();
    ctx.text('Signature (electronic signature embedded in this PDF file)', {
      sizePt: theme.sizesPt.small,
      color: theme.colors.muted,
      xPt: frame.leftPt + half,
      yPt: lineY + 3,
      widthPt: half,
    });
    ctx.gap(8);
  },
};
