/**
 * Printed as "Additions, deviations and exclusions" from the method (ISO/IEC 17025:2017
 * 7.8.2.1 n); an empty list prints "None.".
 */
import type { ReportSection } from '../report-section';

export const deviationsSection: ReportSection = {
  id: 'deviations',
  render(ctx, report) {
    ctx.heading('Additions, deviations and exclusions');
    if (report.deviations.length === 0) {
      ctx.paragraph('None.');
      return;
    }
    for (const deviation of report.deviations) ctx.paragraph(`\u2022  ${deviation}`);
  },
};
