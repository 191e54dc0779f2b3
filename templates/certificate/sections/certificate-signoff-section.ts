/** Printed last on the certificate: authorization, signature line, verification QR, end mark. */
import { drawQrCode } from '../../pdf-kit/qr-code';
import { formatTimestampUtc } from '../../report/sections/authorization-section';
import type { CertificateSection } from '../certificate-section';

const QR_SIZE_PT = 84;

export const certificateSignoffSection: CertificateSection = {
  id: 'signoff',
  render(ctx, cert) {
    const { doc, frame, theme } = ctx;
    const { accent, muted, text } = theme.colors;
    const small = theme.sizesPt.small;
    ctx.ensureSpace(QR_SIZE_PT + 24);
    ctx.gap(8);
    const top = ctx.y;
    const a = cert.authorizedBy;
    const caption = { font: 'medium' as const, sizePt: small, color: muted };
    ctx.text('Authorized by', { ...caption, yPt: top, widthPt: 220 });
    ctx.text(a.name, { font: 'medium', widthPt: 220 });
    ctx.text(`${a.role}, ${formatTimestampUtc(a.authorizedAt)}`, { widthPt: 220 });
    const lineY = ctx.y + 24;
    doc.moveTo(frame.leftPt, lineY).lineTo(frame.leftPt + 215, lineY);
    doc.lineWidth(0.6).strokeColor(text).stroke();
    ctx.text('Signature (electronic signature embedded in this PDF file)', {
      sizePt: theme.sizesPt.tiny,
      color: muted,
      yPt: lineY + 3,
      widthPt: 220,
    });
    const qrX = frame.rightPt - QR_SIZE_PT + 8;
    drawQrCode(ctx, cert.verificationUrl, qrX, top - 8, QR_SIZE_PT);
    const column = { xPt: frame.leftPt + 228, widthPt: qrX - 4 - (frame.leftPt + 228) };
    ctx.text('Verify this certificate', {
      font: 'medium',
      sizePt: small,
      yPt: top + 14,
      align: 'right',
      ...column,
    });
    ctx.text('Scan the code or open the address below.', {
      sizePt: small,
      color: muted,
      align: 'right',
      ...column,
    });
    // The address on one line under the QR code, right-aligned to the frame, never wrapped.
    const urlY = Math.max(lineY + 14, top + QR_SIZE_PT - 4);
    ctx.text(cert.verificationUrl, {
      font: 'medium',
      sizePt: small,
      color: accent,
      yPt: urlY,
      widthPt: frame.widthPt,
      align: 'right',
    });
    ctx.y = Math.max(ctx.y, lineY + 14) + 10;
    ctx.text(`End of certificate ${cert.certificateNumber}`, {
      font: 'medium',
      sizePt: small,
      color: accent,
      align: 'center',
    });
  },
};
