/**
 * Printed at the top of page 1: the issuing lab (logo, name, address, contacts, accreditation),
 * the title, the report's identification and, for an amendment, what it replaces and why
 * (ISO/IEC 17025:2017 7.8.2.1 a, b, d, j and 7.8.8).
 */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReportSection } from '../report-section';

export const titleBlockSection: ReportSection = {
  id: 'title-block',
  render(ctx, report) {
    const { doc, theme, frame } = ctx;
    const top = ctx.y;
    let textLeft = frame.leftPt;
    if (report.lab.logoPng && report.lab.logoPng.length > 0) {
      doc.image(Buffer.from(report.lab.logoPng), frame.leftPt, top, { fit: [110, 48] });
      textLeft += 122;
    }
    const lab = report.lab;
    const accent = theme.colors.accent;
    ctx.text(lab.name, { font: 'medium', sizePt: 13, color: accent, xPt: textLeft, yPt: top });
    const reach = [lab.phone, lab.email].filter(Boolean).join('  \u2022  ');
    const contact = [...lab.addressLines, reach, lab.accreditation ?? ''].filter((l) => l !== '');
    const muted = theme.colors.muted;
    ctx.text(contact.join('\n'), { sizePt: theme.sizesPt.small, color: muted, xPt: textLeft });
    ctx.y = Math.max(ctx.y, top + 48) + 28;

    ctx.text(report.title, { font: 'medium', sizePt: theme.sizesPt.title });
    ctx.gap(4);
    const d = report.device;
    const item = `${d.manufacturer} ${d.model}, serial number ${d.serialNumber}`;
    ctx.text(item, { sizePt: 11, color: theme.colors.muted });
    ctx.gap(16);

    drawKeyValueList(ctx, [
      { label: 'Report number', value: report.reportNumber },
      { label: 'Revision', value: String(report.revision) },
      { label: 'Date of issue', value: report.dates.issued },
      { label: 'Client', value: report.client.name },
    ]);

    if (report.replaces) {
      const { reportNumber, reason } = report.replaces;
      const text =
        `This report amends and replaces report ${reportNumber}, which is withdrawn. ` +
        `Reason: ${reason}`;
      const height = ctx.measure(text, { widthPt: frame.widthPt - 20 }) + 14;
      ctx.ensureSpace(height);
      const y = ctx.y;
      doc.rect(frame.leftPt, y, frame.widthPt, height).fill(theme.colors.accentTint);
      doc.rect(frame.leftPt, y, 3, height).fill(theme.colors.accent);
      ctx.text(text, { xPt: frame.leftPt + 12, yPt: y + 7, widthPt: frame.widthPt - 20 });
      ctx.y = y + height + 8;
    }
    ctx.text(
      'The results in this report relate only to the item tested, as received. This report ' +
        'shall not be reproduced except in full without the written approval of the laboratory.',
      { sizePt: theme.sizesPt.small, color: theme.colors.muted },
    );
    ctx.gap(6);
  },
};
