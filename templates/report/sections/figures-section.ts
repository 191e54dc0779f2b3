/**
 * Printed as "Figures": each result's plot (trace or PSD with its limit line and the worst point
 * marked, or an intermodulation spectrum as stems), two to a page, captioned with the test point.
 */
import { drawPlot } from '../../pdf-kit/plot';
import type { ReportSection } from '../report-section';

const PLOT_HEIGHT_PT = 272;

export const figuresSection: ReportSection = {
  id: 'figures',
  render(ctx, report) {
    const withPlots = report.results.filter((r) => r.plot);
    if (withPlots.length === 0) return;
    ctx.heading('Figures');
    withPlots.forEach((result, i) => {
      ctx.ensureSpace(PLOT_HEIGHT_PT + 36);
      const { leftPt, widthPt } = ctx.frame;
      const box = { xPt: leftPt, yPt: ctx.y, widthPt, heightPt: PLOT_HEIGHT_PT };
      if (result.plot) drawPlot(ctx, result.plot, box);
      ctx.gap(4);
      ctx.text(`Figure ${i + 1}. ${result.testName}, ${result.testPoint}.`, {
        sizePt: ctx.theme.sizesPt.small,
        color: ctx.theme.colors.muted,
      });
      ctx.gap(18);
    });
  },
};
