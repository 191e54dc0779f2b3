/** Printed last on the certificate: authorization with signature line, the verification QR and an end mark. */
import { drawQrCode } from '../../pdf-kit/qr-code';
import { formatTimestampUtc } from '../../report/sections/authorization-section';
import type { CertificateSection } from '../certificate-section';

const QR_SIZE_PT = 84;

export const certificateSignoffSection: CertificateSection = {
  id: 'signoff',
  render(ctx, cert) {
    const { doc, frame, theme } = ctx;
    ctx.ensureSpace(QR_SIZE_PT + 24);
    ctx.gap(8);
    const top = ctx.y;
    const a = cert.authorizedBy;
    ctx.text('Authorized by', { font: 'medium', sizePt: theme.sizesPt.small, color: theme.colors.muted, yPt: top, widthPt: 220 });
    ctx.text(a.name, { font: 'medium', widthPt: 220 });
    ctx.text(`${a.role}, ${formatTimestampUtc(a.authorizedAt)}`, { widthPt: 220 });
    const lineY = ctx.y + 24;
    doc.moveTo(frame.leftPt, lineY).lineTo(frame.leftPt + 215, lineY).lineWidth(0.6).strokeColor(theme.colors.text).stroke();
    ctx.text('Signature (electronic signature embedded in this PDF file)', {
      sizePt: theme.sizesPt.tiny,
      color: theme.colors.muted,
      yPt: lineY + 3,
      widthPt: 220,
    });
    const qrX = frame.rightPt - QR_SIZE_PT + 8;
    drawQrCode(ctx, cert.verificationUrl, qrX, top - 8, QR_SIZE_PT);
    const textRight = qrX - 4;
    ctx.text('Verify at', { font: 'medium', sizePt: theme.sizesPt.small, xPt: frame.leftPt + 228, yPt: top + 18, widthPt: textRight - frame.leftPt - 228, align: 'right' });
    ctx.text(cert.verificationUrl, { sizePt: theme.sizesPt.small, color: theme.colors.accent, xPt: frame.leftPt + 228, widthPt: textRight - frame.leftPt - 228, align: 'right' });
    ctx.y = Math.max(ctx.y, lineY + 14, top + QR_SIZE_PT - 8) + 10;
    ctx.text(`End of certificate ${cert.certificateNumber}`, { font: 'medium', sizePt: theme.sizesPt.small, color: theme.colors.accent, align: 'center' });
  },
};
