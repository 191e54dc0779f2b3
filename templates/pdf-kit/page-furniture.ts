/**
 * Printed on every page once the content is laid out: a header (issuer left, document number
 * right, hairline below) and a footer (identification left, "Page x of y" right). Needs a
 * document created with `bufferPages: true`, because the page total is known only at the end.
 */
import { toPrintableText } from './printable-text';
import type { Theme } from './theme';

export interface PageFurniture {
  headerLeft: string;
  headerRight: string;
  footerLeft: string;
}

/**
 * Stamps header and footer on each buffered page and returns the page count. Text is drawn with
 * `lineBreak: false` and the bottom margin lifted meanwhile, so pdfkit never adds a page for it.
 * @example stampPageFurniture(doc, DEFAULT_THEME, { headerLeft: 'Lab', headerRight: 'R-1',
 *   footerLeft: 'Report R-1' }) // 3 (the page count)
 */
export function stampPageFurniture(
  doc: PDFKit.PDFDocument,
  theme: Theme,
  furniture: PageFurniture,
): number {
  const { start, count } = doc.bufferedPageRange();
  const m = theme.marginsPt;
  for (let i = 0; i < count; i++) {
    doc.switchToPage(start + i);
    const { width, height } = doc.page;
    const savedBottom = doc.page.margins.bottom;
    doc.page.margins.bottom = 0;
    const right = width - m.right;
    const headerY = m.top - 30;
    doc.font('medium').fontSize(theme.sizesPt.small).fillColor(theme.colors.accent);
    doc.text(toPrintableText(furniture.headerLeft), m.left, headerY, { lineBreak: false });
    doc.font('regular').fillColor(theme.colors.muted);
    const headerRight = toPrintableText(furniture.headerRight);
    doc.text(headerRight, right - doc.widthOfString(headerRight), headerY, { lineBreak: false });
    doc.moveTo(m.left, headerY + 13).lineTo(right, headerY + 13);
    doc.lineWidth(0.5).strokeColor(theme.colors.rule).stroke();

    const footerY = height - m.bottom + 22;
    doc.moveTo(m.left, footerY - 7).lineTo(right, footerY - 7);
    doc.lineWidth(0.5).strokeColor(theme.colors.rule).stroke();
    doc.font('regular').fontSize(theme.sizesPt.small).fillColor(theme.colors.muted);
    doc.text(toPrintableText(furniture.footerLeft), m.left, footerY, { lineBreak: false });
    const pageText = `Page ${i + 1} of ${count}`;
    doc.font('medium').fillColor(theme.colors.text);
    doc.text(pageText, right - doc.widthOfString(pageText), footerY, { lineBreak: false });
    doc.page.margins.bottom = savedBottom;
  }
  return count;
}
