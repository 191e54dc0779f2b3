/**
 * Printed as a boxed caution: the hazards of the setup (common practice of RF test labs) and
 * deference to local rules. The box never splits across pages.
 */
import type { ReportSection } from '../report-section';

export const SAFETY_CAUTION =
  'RF power delivered into dummy loads and antennas can cause burns and expose people to RF ' +
  'fields. Power amplifier stages carry high voltage, and loads and attenuators run hot. ' +
  'Anyone repeating these tests must follow local regulations, RF-exposure rules and ' +
  'licensed practice.';

export const safetySection: ReportSection = {
  id: 'safety',
  render(ctx) {
    const { doc, theme, frame } = ctx;
    const width = frame.widthPt - 24;
    const height = ctx.measure(SAFETY_CAUTION, { widthPt: width }) + 32;
    ctx.ensureSpace(height + 16);
    ctx.gap(12);
    const y = ctx.y;
    doc.rect(frame.leftPt, y, frame.widthPt, height).fill(theme.colors.accentTint);
    doc.rect(frame.leftPt, y, 3, height).fill(theme.colors.conditional);
    ctx.text('Safety caution', {
      font: 'medium',
      color: theme.colors.conditional,
      xPt: frame.leftPt + 14,
      yPt: y + 8,
      widthPt: width,
    });
    ctx.text(SAFETY_CAUTION, { xPt: frame.leftPt + 14, yPt: y + 21, widthPt: width });
    ctx.y = y + height + 6;
  },
};
