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
    const textLeft = frame.leftPt + 228;
    const textWidth = qrX - 4 - textLeft;
    ctx.text('Verify this certificate', { font: 'medium', sizePt: theme.sizesPt.small, xPt: textLeft, yPt: top + 14, widthPt: textWidth, align: 'right' });
    ctx.text('Scan the code or open the address below.', { sizePt: theme.sizesPt.small, color: theme.colors.muted, xPt: textLeft, widthPt: textWidth, align: 'right' });
    // The address on one line under the QR code, right-aligned to the frame, never wrapped.
    const urlY = Math.max(lineY + 14, top + QR_SIZE_PT - 4);
    ctx.text(cert.verificationUrl, { font: 'medium', sizePt: theme.sizesPt.small, color: theme.colors.accent, xPt: frame.leftPt, yPt: urlY, widthPt: frame.widthPt, align: 'right' });
    ctx.y = Math.max(ctx.y, lineY + 14) + 10;
    ctx.text(`End of certificate ${cert.certificateNumber}`, { font: 'medium', sizePt: theme.sizesPt.small, color: theme.colors.accent, align: 'center' });
  },
};
