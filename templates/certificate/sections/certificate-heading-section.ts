/** Printed at the top of the certificate: issuing lab, title, number and the statement. */
import { certificateTitle } from '../certificate-document';
import type { CertificateSection } from '../certificate-section';

export const certificateHeadingSection: CertificateSection = {
  id: 'heading',
  render(ctx, cert) {
    const { doc, theme, frame } = ctx;
    const top = ctx.y;
    if (cert.lab.logoPng && cert.lab.logoPng.length > 0) {
      const x = frame.leftPt + frame.widthPt / 2 - 55;
      doc.image(Buffer.from(cert.lab.logoPng), x, top, { fit: [110, 44], align: 'center' });
      ctx.y = top + 52;
    }
    const { accent, muted } = theme.colors;
    ctx.text(cert.lab.name, { font: 'medium', sizePt: 12, color: accent, align: 'center' });
    const address = [...cert.lab.addressLines, cert.lab.accreditation ?? ''].filter(Boolean);
    const small = theme.sizesPt.small;
    ctx.text(address.join('  \u2022  '), { sizePt: small, color: muted, align: 'center' });
    ctx.gap(20);
    const title = certificateTitle(cert.overallVerdict);
    ctx.text(title, { font: 'medium', sizePt: 24, align: 'center' });
    ctx.gap(4);
    const number = `No. ${cert.certificateNumber}   \u2022   issued ${cert.issued}`;
    ctx.text(number, { color: muted, align: 'center' });
    ctx.gap(10);
    const ruleY = ctx.y;
    doc.moveTo(frame.leftPt + 120, ruleY).lineTo(frame.rightPt - 120, ruleY);
    doc.lineWidth(0.8).strokeColor(accent).stroke();
    ctx.gap(12);
    const r = cert.report;
    const m = cert.method;
    ctx.paragraph(
      `${cert.lab.name} tested the equipment identified below to the rule set ` +
        `"${m.ruleSetName}", version ${m.ruleSetVersion}. The verdict for each test is ` +
        'summarised here; the full results, measurement uncertainties and conditions are in ' +
        `test report ${r.reportNumber}, revision ${r.revision}, issued ${r.issued}, which this ` +
        'certificate refers to and without which it is not valid.',
      { align: 'justify' },
    );
  },
};
