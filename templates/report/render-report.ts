/**
 * Printed as the test report PDF (unsigned; server/signing adds the signature). Runs the report's
 * section list through the shared generator core with the report number in every page's header
 * and footer.
 */
import { renderSectionsToPdf, type RenderedPdf } from '../pdf-kit/render-sections';
import type { Theme } from '../pdf-kit/theme';
import type { ReportDocument } from './report-document';
import type { ReportSection } from './report-section';
import { REPORT_SECTIONS } from './report-sections';

export interface RenderReportOptions {
  /** Defaults to {@link REPORT_SECTIONS}. */
  sections?: readonly ReportSection[];
  theme?: Theme;
}

/**
 * Renders the report and returns the PDF bytes and the page count. Errors name the failing
 * section (see renderSectionsToPdf).
 * @example const { pdf, pageCount } = await renderReportPdf(buildSampleReportDocument());
 *   // pageCount 5
 */
export function renderReportPdf(
  report: ReportDocument,
  options: RenderReportOptions = {},
): Promise<RenderedPdf> {
  const d = report.device;
  const identification = `Report ${report.reportNumber}, revision ${report.revision}`;
  return renderSectionsToPdf(report, options.sections ?? REPORT_SECTIONS, {
    theme: options.theme,
    metadata: {
      title: `${report.title} (${report.reportNumber})`,
      author: report.lab.name,
      subject: `${d.manufacturer} ${d.model}, serial ${d.serialNumber}`,
      keywords: [report.method.ruleSetName, report.device.emissionDesignator].join(', '),
    },
    furniture: {
      headerLeft: report.lab.name,
      headerRight: `Test report ${report.reportNumber}`,
      footerLeft: identification,
    },
  });
}
