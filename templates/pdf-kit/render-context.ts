/**
 * The drawing state handed to every section renderer: the pdfkit document, the theme, the content
 * frame and a vertical cursor, plus the few text primitives sections share.
 *
 * All text goes through {@link toPrintableText}. Positions are PDF points from the top-left of
 * the page (pdfkit's convention). Sections draw from `y` downwards and leave `y` below what they
 * drew; `ensureSpace` starts a new page when the next block would cross the bottom margin.
 */
import { toPrintableText } from './printable-text';
import type { FontRole, Theme } from './theme';

/** The printable area of a page, inside the theme margins. */
export interface ContentFrame {
  leftPt: number;
  rightPt: number;
  topPt: number;
  bottomPt: number;
  widthPt: number;
}

export interface TextStyle {
  font?: FontRole;
  sizePt?: number;
  color?: string;
  align?: 'left' | 'right' | 'center' | 'justify';
  /** Left edge; defaults to the frame's left edge. */
  xPt?: number;
  /** Top edge; defaults to the cursor. */
  yPt?: number;
  /** Wrap width; defaults to the rest of the frame from xPt. */
  widthPt?: number;
  lineGapPt?: number;
}

export class RenderContext {
  readonly frame: ContentFrame;
  private headingCount = 0;

  constructor(
    readonly doc: PDFKit.PDFDocument,
    readonly theme: Theme,
  ) {
    const { widthPt, heightPt } = { widthPt: doc.page.width, heightPt: doc.page.height };
    const m = theme.marginsPt;
    this.frame = {
      leftPt: m.left,
      rightPt: widthPt - m.right,
      topPt: m.top,
      bottomPt: heightPt - m.bottom,
      widthPt: widthPt - m.left - m.right,
    };
  }

  /** The cursor: top of the next block, in points from the top of the page. */
  get y(): number {
    return this.doc.y;
  }

  set y(value: number) {
    this.doc.y = value;
  }

  /** Starts a new page with the cursor at the top of the frame. */
  addPage(): void {
    this.doc.addPage();
    this.doc.x = this.frame.leftPt;
    this.doc.y = this.frame.topPt;
  }

  /** Starts a new page unless `heightPt` fits above the bottom margin (or the page is empty). */
  ensureSpace(heightPt: number): void {
    if (this.y + heightPt > this.frame.bottomPt && this.y > this.frame.topPt + 1) this.addPage();
  }

  /** Moves the cursor down. */
  gap(heightPt: number): void {
    this.y = Math.min(this.y + heightPt, this.frame.bottomPt);
  }

  /** Sets font, size and colour on the document and returns the resolved wrap width. */
  applyStyle(style: TextStyle): number {
    const xPt = style.xPt ?? this.frame.leftPt;
    this.doc.font(style.font ?? 'regular').fontSize(style.sizePt ?? this.theme.sizesPt.body);
    this.doc.fillColor(style.color ?? this.theme.colors.text);
    return style.widthPt ?? this.frame.rightPt - xPt;
  }

  /** Height the text would take with the style, without drawing it. */
  measure(text: string, style: TextStyle = {}): number {
    const widthPt = this.applyStyle(style);
    const lineGap = style.lineGapPt ?? this.theme.lineGapPt;
    return this.doc.heightOfString(toPrintableText(text), { width: widthPt, lineGap });
  }

  /** Draws wrapped text, moves the cursor below it and returns the height used. */
  text(text: string, style: TextStyle = {}): number {
    const widthPt = this.applyStyle(style);
    const top = style.yPt ?? this.y;
    this.doc.text(toPrintableText(text), style.xPt ?? this.frame.leftPt, top, {
      width: widthPt,
      align: style.align ?? 'left',
      lineGap: style.lineGapPt ?? this.theme.lineGapPt,
    });
    return this.doc.y - top;
  }

  /** A numbered section heading with an accent rule; kept together with the next ~3 lines. */
  heading(title: string): void {
    this.ensureSpace(70);
    if (this.y > this.frame.topPt + 1) this.gap(14);
    this.headingCount += 1;
    const top = this.y;
    this.text(`${this.headingCount}   ${title}`, {
      font: 'medium',
      sizePt: this.theme.sizesPt.heading,
      color: this.theme.colors.accent,
    });
    const ruleY = this.y + 2;
    this.doc
      .moveTo(this.frame.leftPt, ruleY)
      .lineTo(this.frame.rightPt, ruleY)
      .lineWidth(0.6)
      .strokeColor(this.theme.colors.accent)
      .stroke();
    this.y = Math.max(ruleY + 7, top);
  }

  /** An unnumbered sub-heading in medium weight. */
  subheading(title: string): void {
    this.ensureSpace(50);
    this.gap(4);
    this.text(title, { font: 'medium', sizePt: this.theme.sizesPt.subheading });
    this.gap(3);
  }

  /** A body paragraph followed by a small gap. */
  paragraph(text: string, style: TextStyle = {}): void {
    this.text(text, style);
    this.gap(5);
  }
}
