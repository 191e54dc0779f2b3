/**
 * Tables that break across pages cleanly, with the header row repeated on every page.
 *
 * Built for speed: each cell is one text call (single-line cells skip pdfkit's line wrapper),
 * font, size and colour are set only when they change, and the rules of each page are collected
 * and stroked as one path. pdfkit's own table API costs about five times as much per row.
 */
import { toPrintableText } from './printable-text';
import type { RenderContext } from './render-context';
import type { FontRole } from './theme';

export interface TableColumn {
  header: string;
  /** Share of the table width (weights are normalised over all columns). */
  widthWeight: number;
  align?: 'left' | 'right' | 'center';
}

export interface TableCellStyle {
  font?: FontRole;
  color?: string;
}

export interface TableSpec {
  columns: readonly TableColumn[];
  rows: readonly (readonly string[])[];
  /** Per-cell emphasis (verdict colours, for example). */
  cellStyle?: (rowIndex: number, columnIndex: number) => TableCellStyle | undefined;
  /** Type size in points (default: the theme's small size). */
  sizePt?: number;
}

const PAD_X_PT = 4;
const PAD_Y_PT = 3.2;
const LINE_GAP_PT = 1;

/**
 * Draws the table from the cursor down and returns the number of pages it touched.
 * Throws a RangeError when a row's cell count differs from the column count.
 * @example drawTable(ctx, { columns: [{ header: 'Name', widthWeight: 1 }], rows: [['A']] }) // 1
 */
export function drawTable(ctx: RenderContext, spec: TableSpec): number {
  const { doc, theme, frame } = ctx;
  const total = spec.columns.reduce((sum, c) => sum + c.widthWeight, 0);
  const widths = spec.columns.map((c) => (frame.widthPt * c.widthWeight) / total);
  const lefts = widths.map((_, i) => frame.leftPt + widths.slice(0, i).reduce((a, b) => a + b, 0));
  const sizePt = spec.sizePt ?? theme.sizesPt.small;
  let font: FontRole | undefined;
  let color: string | undefined;
  const use = (nextFont: FontRole, nextColor: string) => {
    if (nextFont !== font) doc.font(nextFont).fontSize(sizePt);
    if (nextColor !== color) doc.fillColor(nextColor);
    font = nextFont;
    color = nextColor;
  };
  const lineHeightPt = (role: FontRole) => {
    use(role, color ?? theme.colors.text);
    return doc.currentLineHeight(true) + LINE_GAP_PT;
  };

  const layoutRow = (cells: readonly string[], styleOf: (col: number) => TableCellStyle) => {
    if (cells.length !== widths.length) {
      const counts = `${cells.length} cells for ${widths.length} columns`;
      throw new RangeError(`drawTable: a row has ${counts}`);
    }
    let heightPt = 0;
    const prepared = cells.map((raw, col) => {
      const text = toPrintableText(raw);
      const role = styleOf(col).font ?? 'regular';
      const inner = widths[col] - 2 * PAD_X_PT;
      use(role, color ?? theme.colors.text);
      const textWidth = doc.widthOfString(text);
      const singleLine = !text.includes('\n') && textWidth <= inner;
      const h = singleLine
        ? lineHeightPt(role)
        : doc.heightOfString(text, { width: inner, lineGap: LINE_GAP_PT });
      heightPt = Math.max(heightPt, h);
      return { text, role, inner, textWidth, singleLine };
    });
    return { prepared, heightPt: heightPt + 2 * PAD_Y_PT };
  };

  type LaidOutRow = ReturnType<typeof layoutRow>;
  const drawRow = (row: LaidOutRow, top: number, styleOf: (col: number) => TableCellStyle) => {
    row.prepared.forEach((cell, col) => {
      use(cell.role, styleOf(col).color ?? theme.colors.text);
      const align = spec.columns[col].align ?? 'left';
      const x = lefts[col] + PAD_X_PT;
      if (cell.singleLine) {
        const free = cell.inner - cell.textWidth;
        const shift = align === 'right' ? free : align === 'center' ? free / 2 : 0;
        doc.text(cell.text, x + shift, top + PAD_Y_PT, { lineBreak: false });
      } else {
        doc.text(cell.text, x, top + PAD_Y_PT, { width: cell.inner, align, lineGap: LINE_GAP_PT });
      }
    });
  };

  const headerStyle = (): TableCellStyle => ({ font: 'medium', color: theme.colors.accent });
  const header = layoutRow(spec.columns.map((c) => c.header), headerStyle);
  let rules: number[] = [];
  let pages = 1;
  const startPage = () => {
    font = undefined;
    color = undefined;
    const top = ctx.y;
    doc.rect(frame.leftPt, top, frame.widthPt, header.heightPt).fill(theme.colors.accentTint);
    color = theme.colors.accentTint;
    drawRow(header, top, headerStyle);
    ctx.y = top + header.heightPt;
    rules = [top, ctx.y];
  };
  const finishPage = () => {
    for (const y of rules) doc.moveTo(frame.leftPt, y).lineTo(frame.rightPt, y);
    doc.lineWidth(0.4).strokeColor(theme.colors.rule).stroke();
  };

  const noStyle = (): TableCellStyle => ({});
  const styleFor = (rowIndex: number) =>
    spec.cellStyle ? (col: number) => spec.cellStyle?.(rowIndex, col) ?? {} : noStyle;
  const first = spec.rows.length > 0 ? layoutRow(spec.rows[0], styleFor(0)) : undefined;
  ctx.ensureSpace(header.heightPt + (first?.heightPt ?? 0));
  startPage();
  spec.rows.forEach((cells, rowIndex) => {
    const styleOf = styleFor(rowIndex);
    const row = rowIndex === 0 && first ? first : layoutRow(cells, styleOf);
    if (ctx.y + row.heightPt > frame.bottomPt) {
      finishPage();
      ctx.addPage();
      pages += 1;
      startPage();
    }
    const top = ctx.y;
    drawRow(row, top, styleOf);
    ctx.y = top + row.heightPt;
    rules.push(ctx.y);
  });
  finishPage();
  ctx.gap(8);
  return pages;
}
