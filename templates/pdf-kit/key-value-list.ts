/**
 * A two-column block of labelled values ("Model: OV-HF150"), used for the client, item, dates
 * and conditions. Labels sit in muted medium type on the left; values wrap on the right. A row
 * never splits across pages.
 */
import type { RenderContext } from './render-context';

export interface KeyValueRow {
  label: string;
  value: string;
}

export interface KeyValueListOptions {
  /** Width of the label column in points (default 150). */
  labelWidthPt?: number;
  /** Left edge in points (default: the frame's left edge). */
  xPt?: number;
  /** Total width in points (default: to the frame's right edge). */
  widthPt?: number;
}

/**
 * Draws the rows from the cursor down with a hairline between rows, stroked as one path per page.
 * An empty value prints as an em dash. Throws a RangeError when the label column leaves no room.
 * @example drawKeyValueList(ctx, [{ label: 'Serial number', value: 'OV15-00231' }]);
 */
export function drawKeyValueList(
  ctx: RenderContext,
  rows: readonly KeyValueRow[],
  options: KeyValueListOptions = {},
): void {
  const { doc, theme } = ctx;
  const xPt = options.xPt ?? ctx.frame.leftPt;
  const widthPt = options.widthPt ?? ctx.frame.rightPt - xPt;
  const labelWidthPt = options.labelWidthPt ?? 150;
  const valueWidthPt = widthPt - labelWidthPt - 8;
  if (!(valueWidthPt > 20)) {
    const sizes = `label column ${labelWidthPt} pt leaves no room in ${widthPt} pt`;
    throw new RangeError(`drawKeyValueList: ${sizes}`);
  }
  const padPt = 3;
  let rules: number[] = [];
  const strokeRules = () => {
    for (const y of rules) doc.moveTo(xPt, y).lineTo(xPt + widthPt, y);
    if (rules.length > 0) doc.lineWidth(0.4).strokeColor(theme.colors.rule).stroke();
    rules = [];
  };
  for (const row of rows) {
    const value = row.value.trim() === '' ? '\u2014' : row.value;
    const labelStyle = {
      font: 'medium' as const,
      color: theme.colors.muted,
      widthPt: labelWidthPt,
      xPt,
    };
    const valueStyle = { widthPt: valueWidthPt, xPt: xPt + labelWidthPt + 8 };
    const contentPt = Math.max(ctx.measure(row.label, labelStyle), ctx.measure(value, valueStyle));
    const heightPt = contentPt + 2 * padPt;
    if (ctx.y + heightPt > ctx.frame.bottomPt) {
      strokeRules();
      ctx.addPage();
    }
    const top = ctx.y;
    ctx.text(row.label, { ...labelStyle, yPt: top + padPt });
    ctx.text(value, { ...valueStyle, yPt: top + padPt });
    ctx.y = top + heightPt;
    rules.push(ctx.y);
  }
  strokeRules();
  ctx.gap(6);
}
