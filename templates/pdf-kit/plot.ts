/**
 * Draws a {@link PlotSpec} as vector graphics (moveTo/lineTo paths, no images): title, legend,
 * axes with ticks, traces as lines, limits as dashed lines, intermodulation products as stems and
 * the worst point circled, its label in the legend. Long traces are thinned with min-max buckets
 * at about two buckets per point of plot width, which keeps every peak visible.
 */
import { decimateMinMax } from './min-max-decimation';
import { drawPlotAxes, type BoxPt, type PlotMapping } from './plot-axes';
import type { PlotSeries, PlotSpec } from './plot-spec';
import { toPrintableText } from './printable-text';
import type { RenderContext } from './render-context';

function range(values: ArrayLike<number>, into: [number, number]): void {
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (Number.isFinite(v)) {
      if (v < into[0]) into[0] = v;
      if (v > into[1]) into[1] = v;
    }
  }
}

function seriesColor(ctx: RenderContext, role: PlotSeries['role']): string {
  const { colors } = ctx.theme;
  return role === 'limit' ? colors.limit : role === 'products' ? colors.text : colors.accent;
}

function drawSeries(ctx: RenderContext, series: PlotSeries, map: PlotMapping): void {
  const { doc } = ctx;
  const bottom = map.area.yPt + map.area.heightPt;
  if (series.role === 'products') {
    for (let i = 0; i < series.x.length; i++) {
      if (!Number.isFinite(series.y[i])) continue;
      const x = map.toPageX(series.x[i]);
      doc.moveTo(x, bottom).lineTo(x, map.toPageY(series.y[i]));
    }
    doc.lineWidth(1.1).strokeColor(seriesColor(ctx, 'products')).stroke();
    for (let i = 0; i < series.x.length; i++) {
      if (!Number.isFinite(series.y[i])) continue;
      doc.circle(map.toPageX(series.x[i]), map.toPageY(series.y[i]), 1.8);
    }
    doc.fillColor(seriesColor(ctx, 'products')).fill();
    return;
  }
  const { x, y } = decimateMinMax(series.x, series.y, Math.ceil(map.area.widthPt * 2));
  let penDown = false;
  for (let i = 0; i < x.length; i++) {
    if (!Number.isFinite(y[i])) {
      penDown = false;
      continue;
    }
    const px = map.toPageX(x[i]);
    const py = map.toPageY(y[i]);
    if (penDown) doc.lineTo(px, py);
    else doc.moveTo(px, py);
    penDown = true;
  }
  doc.lineWidth(series.role === 'limit' ? 1 : 0.7).strokeColor(seriesColor(ctx, series.role));
  if (series.role === 'limit') doc.dash(4, { space: 2 });
  doc.stroke();
  doc.undash();
}

function drawLegend(ctx: RenderContext, spec: PlotSpec, box: BoxPt, y: number): void {
  const { doc, theme } = ctx;
  let x = box.xPt + 46;
  doc.font('regular').fontSize(theme.sizesPt.tiny);
  for (const series of spec.series) {
    const name = toPrintableText(series.name);
    doc.moveTo(x, y + 4).lineTo(x + 14, y + 4);
    doc.lineWidth(series.role === 'products' ? 1.1 : 1).strokeColor(seriesColor(ctx, series.role));
    if (series.role === 'limit') doc.dash(3, { space: 1.5 });
    doc.stroke().undash();
    doc.fillColor(theme.colors.text).text(name, x + 18, y, { lineBreak: false });
    x += 28 + doc.widthOfString(name);
  }
  if (spec.marker) {
    // The marker's label sits in the legend, so it can never cover a trace or limit line.
    const label = toPrintableText(spec.marker.label);
    doc.circle(x + 4, y + 4, 3).lineWidth(1.1).strokeColor(theme.colors.limit).stroke();
    doc.font('medium').fillColor(theme.colors.limit).text(label, x + 11, y, { lineBreak: false });
  }
}

/**
 * Draws the plot inside `box` (points, top-left origin). A plot with no finite data draws its
 * frame and the words "No data". Throws a RangeError when a series has unequal x and y lengths.
 * @example drawPlot(ctx, spec, { xPt: 57, yPt: 100, widthPt: 480, heightPt: 260 });
 */
export function drawPlot(ctx: RenderContext, spec: PlotSpec, box: BoxPt): void {
  const { doc, theme } = ctx;
  for (const s of spec.series) {
    if (s.x.length !== s.y.length) {
      const counts = `${s.x.length} x and ${s.y.length} y values`;
      throw new RangeError(`drawPlot: series "${s.name}" has ${counts}`);
    }
  }
  ctx.text(spec.title, {
    font: 'medium',
    sizePt: theme.sizesPt.subheading,
    xPt: box.xPt,
    yPt: box.yPt,
    widthPt: box.widthPt,
  });
  drawLegend(ctx, spec, box, box.yPt + 17);
  const axesBox: BoxPt = {
    xPt: box.xPt,
    yPt: box.yPt + 30,
    widthPt: box.widthPt,
    heightPt: box.heightPt - 30,
  };
  const xRange: [number, number] = [Infinity, -Infinity];
  const yRange: [number, number] = [Infinity, -Infinity];
  for (const s of spec.series) {
    range(s.x, xRange);
    range(s.y, yRange);
  }
  if (spec.marker) {
    range([spec.marker.x], xRange);
    range([spec.marker.y], yRange);
  }
  const empty = !(xRange[0] <= xRange[1] && yRange[0] <= yRange[1]);
  if (!empty && spec.series.some((s) => s.role === 'products')) {
    // Stems at the ends of the range would sit on the frame; leave a little room.
    const pad = (xRange[1] - xRange[0]) * 0.03;
    xRange[0] -= pad;
    xRange[1] += pad;
  }
  const map = drawPlotAxes(ctx, axesBox, empty ? [0, 1] : xRange, empty ? [0, 1] : yRange, spec);
  const { area } = map;
  if (empty) {
    doc.font('regular').fontSize(theme.sizesPt.body).fillColor(theme.colors.muted);
    const centre = { x: area.xPt + area.widthPt / 2, y: area.yPt + area.heightPt / 2 };
    doc.text('No data', centre.x - 15, centre.y - 5, { lineBreak: false });
  }
  doc.save();
  doc.rect(area.xPt, area.yPt, area.widthPt, area.heightPt).clip();
  for (const series of spec.series) drawSeries(ctx, series, map);
  doc.restore();
  if (spec.marker && !empty) {
    doc.circle(map.toPageX(spec.marker.x), map.toPageY(spec.marker.y), 4);
    doc.lineWidth(1.2).strokeColor(theme.colors.limit).stroke();
  }
  ctx.y = box.yPt + box.heightPt;
}
