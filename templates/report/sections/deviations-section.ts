/** Printed as "Deviations": additions to, deviations from and exclusions from the method (7.8.2.1 n). */
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
