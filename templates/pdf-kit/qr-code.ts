/**
 * Draws a QR code as vector squares (one filled path), so it stays sharp at any zoom and needs no
 * image decoding. The symbol comes from the qrcode package (ISO/IEC 18004 encoder) with error
 * correction level M (about 15 % of codewords recoverable) and the 4-module quiet zone the
 * standard requires around the symbol.
 */
import QRCode from 'qrcode';
import type { RenderContext } from './render-context';

/** Quiet zone width in modules (ISO/IEC 18004: at least 4). */
export const QR_QUIET_ZONE_MODULES = 4;

/**
 * Draws the QR code for `text` with its top-left corner (quiet zone included) at (xPt, yPt),
 * `sizePt` wide and high, and returns the symbol size in modules (without the quiet zone).
 * Empty text throws a RangeError; text too long for a QR symbol makes the encoder throw.
 * @example drawQrCode(ctx, 'https://verify.example/r/KM-2025-0142', 450, 700, 80) // 29 (version 3)
 */
export function drawQrCode(
  ctx: RenderContext,
  text: string,
  xPt: number,
  yPt: number,
  sizePt: number,
): number {
  if (text.length === 0) throw new RangeError('drawQrCode: text must not be empty');
  const { modules } = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const count = modules.size;
  const modulePt = sizePt / (count + 2 * QR_QUIET_ZONE_MODULES);
  const originX = xPt + QR_QUIET_ZONE_MODULES * modulePt;
  const originY = yPt + QR_QUIET_ZONE_MODULES * modulePt;
  const { doc } = ctx;
  doc.rect(xPt, yPt, sizePt, sizePt).fill('#ffffff');
  for (let row = 0; row < count; row++) {
    // Runs of dark modules in a row become one rectangle: fewer path operators, no hairline seams.
    let col = 0;
    while (col < count) {
      if (!modules.get(row, col)) {
        col++;
        continue;
      }
      const start = col;
      while (col < count && modules.get(row, col)) col++;
      const x = originX + start * modulePt;
      doc.rect(x, originY + row * modulePt, (col - start) * modulePt, modulePt);
    }
  }
  doc.fillColor('#000000').fill();
  return count;
}
