/**
 * Printed beside the authorization: a QR code of the verification address and the address in
 * full, so a reader can check the report is authentic and current, plus the engine version that
 * computed the results (ISO/IEC 17025:2017 7.11).
 */
import { drawQrCode } from '../../pdf-kit/qr-code';
import type { ReportSection } from '../report-section';

const QR_SIZE_PT = 84;

export const verificationSection: ReportSection = {
  id: 'verification',
  render(ctx, report) {
    const { frame, theme } = ctx;
    // Room for the end mark too, so it never stands alone on the last page.
    ctx.ensureSpace(QR_SIZE_PT + 56);
    ctx.gap(6);
    const top = ctx.y;
    drawQrCode(ctx, report.verificationUrl, frame.leftPt - 8, top, QR_SIZE_PT);
    const x = frame.leftPt + QR_SIZE_PT + 6;
    const widthPt = frame.rightPt - x;
    ctx.text('Verify this report', { font: 'medium', xPt: x, yPt: top + 12, widthPt });
    const hint =
      'Scan the code or open the address below to confirm that this report is authentic and ' +
      'has not been replaced.';
    ctx.text(hint, {
      sizePt: theme.sizesPt.small,
      color: theme.colors.muted,
      xPt: x,
      widthPt,
    });
    ctx.text(report.verificationUrl, {
      font: 'medium',
      sizePt: theme.sizesPt.small,
      color: theme.colors.accent,
      xPt: x,
      widthPt,
    });
    ctx.text(`Results computed by Sidecheck measurement engine ${report.engineVersion}.`, {
      sizePt: theme.sizesPt.small,
      color: theme.colors.muted,
      xPt: x,
      widthPt,
    });
    ctx.y = Math.max(ctx.y, top + QR_SIZE_PT) + 4;
  },
};
