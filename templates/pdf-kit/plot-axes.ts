/**
 * The axes of a vector plot: frame, light grid at the ticks, tick labels and axis captions.
 * Returns the data-to-page mapping the series are drawn with.
 */
import { formatNumber } from './format-number';
import { niceTicks, type AxisTicks } from './nice-ticks';
import { toPrintableText } from './printable-text';
import type { RenderContext } from './render-context';

/** A rectangle on the page in points (top-left origin). */
export interface BoxPt {
  xPt: number;
  yPt: number;
  widthPt: number;
  heightPt: number;
}

export interface PlotMapping {
  /** The inner plot area (inside the axes). */
  area: BoxPt;
  xTicks: AxisTicks;
  yTicks: AxisTicks;
  toPageX(x: number): number;
  toPageY(y: number): number;
}

/**
 * Draws axes for data spanning `xRange` and `yRange` inside `box` (tick labels and captions
 * included) and returns the mapping. Ranges must be finite (see {@link niceTicks}).
 */
export function drawPlotAxes(
  ctx: RenderContext,
  box: BoxPt,
  xRange: [number, number],
  yRange: [number, number],
  labels: { xLabel: string; yLabel: string },
): PlotMapping {
  const { doc, theme } = ctx;
  const xTicks = niceTicks(xRange[0], xRange[1], 8);
  const yTicks = niceTicks(yRange[0], yRange[1], 5);
  const area: BoxPt = {
    xPt: box.xPt + 46,
    yPt: box.yPt + 4,
    widthPt: box.widthPt - 54,
    heightPt: box.heightPt - 34,
  };
  const bottom = area.yPt + area.heightPt;
  const xScale = area.widthPt / (xTicks.hi - xTicks.lo);
  const yScale = area.heightPt / (yTicks.hi - yTicks.lo);
  const toPageX = (x: number) => area.xPt + (x - xTicks.lo) * xScale;
  const toPageY = (y: number) => bottom - (y - yTicks.lo) * yScale;
  const right = area.xPt + area.widthPt;

  for (const t of xTicks.ticks) doc.moveTo(toPageX(t), area.yPt).lineTo(toPageX(t), bottom);
  for (const t of yTicks.ticks) doc.moveTo(area.xPt, toPageY(t)).lineTo(right, toPageY(t));
  doc.lineWidth(0.3).strokeColor('#e3e7ea').stroke();
  doc.rect(area.xPt, area.yPt, area.widthPt, area.heightPt);
  doc.lineWidth(0.6).strokeColor(theme.colors.muted).stroke();
  for (const t of xTicks.ticks) doc.moveTo(toPageX(t), bottom).lineTo(toPageX(t), bottom + 3);
  for (const t of yTicks.ticks) doc.moveTo(area.xPt - 3, toPageY(t)).lineTo(area.xPt, toPageY(t));
  doc.lineWidth(0.6).stroke();

  doc.font('regular').fontSize(theme.sizesPt.tiny).fillColor(theme.colors.muted);
  for (const t of xTicks.ticks) {
    const label = formatNumber(t, xTicks.decimals);
    doc.text(label, toPageX(t) - doc.widthOfString(label) / 2, bottom + 5, { lineBreak: false });
  }
  const half = doc.currentLineHeight() / 2;
  for (const t of yTicks.ticks) {
    const label = formatNumber(t, yTicks.decimals);
    const x = area.xPt - 5 - doc.widthOfString(label);
    doc.text(label, x, toPageY(t) - half, { lineBreak: false });
  }

  doc.font('medium').fontSize(theme.sizesPt.small).fillColor(theme.colors.text);
  const xLabel = toPrintableText(labels.xLabel);
  const xLabelLeft = area.xPt + (area.widthPt - doc.widthOfString(xLabel)) / 2;
  doc.text(xLabel, xLabelLeft, bottom + 16, { lineBreak: false });
  const yLabel = toPrintableText(labels.yLabel);
  const yCentre = area.yPt + area.heightPt / 2;
  doc.save();
  doc.rotate(-90, { origin: [box.xPt + 6, yCentre] });
  doc.text(yLabel, box.xPt + 6 - doc.widthOfString(yLabel) / 2, yCentre - 5, { lineBreak: false });
  doc.restore();
  return { area, xTicks, yTicks, toPageX, toPageY };
}
