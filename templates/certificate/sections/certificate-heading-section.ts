/** Printed at the top of the certificate: issuing lab, title, certificate number and the statement. */
import { certificateTitle } from '../certificate-document';
import type { CertificateSection } from '../certificate-section';

export const certificateHeadingSection: CertificateSection = {
  id: 'heading',
  render(ctx, cert) {
    const { doc, theme, frame } = ctx;
    const top = ctx.y;
    if (cert.lab.logoPng && cert.lab.logoPng.length > 0) {
      doc.image(Buffer.from(cert.lab.logoPng), frame.leftPt + frame.widthPt / 2 - 55, top, { fit: [110, 44], align: 'center' });
      ctx.y = top + 52;
    }
    ctx.text(cert.lab.name, { font: 'medium', sizePt: 12, color: theme.colors.accent, align: 'center' });
    ctx.text([...cert.lab.addressLines, cert.lab.accreditation ?? ''].filter(Boolean).join('  \u2022  '), {
      sizePt: theme.sizesPt.small,
      color: theme.colors.muted,
      align: 'center',
    });
    ctx.gap(20);
    ctx.text(certificateTitle(cert.overallVerdict), { font: 'medium', sizePt: 24, align: 'center' });
    ctx.gap(4);
    ctx.text(`No. ${cert.certificateNumber}   \u2022   issued ${cert.issued}`, { color: theme.colors.muted, align: 'center' });
    ctx.gap(10);
    const ruleY = ctx.y;
    doc.moveTo(frame.leftPt + 120, ruleY).lineTo(frame.rightPt - 120, ruleY).lineWidth(0.8).strokeColor(theme.colors.accent).stroke();
    ctx.gap(12);
    const r = cert.report;
    ctx.paragraph(
      `${cert.lab.name} tested the equipment identified below to the rule set "${cert.method.ruleSetName}", version ` +
        `${cert.method.ruleSetVersion}. The verdict for each test is summarised here; the full results, measurement ` +
        `uncertainties and conditions are in test report ${r.reportNumber}, revision ${r.revision}, issued ${r.issued}, ` +
        'which this certificate refers to and without which it is not valid.',
      { align: 'justify' },
    );
  },
};
