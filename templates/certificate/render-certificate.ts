/**
 * Printed as the compliance certificate PDF (unsigned; server/signing adds the signature): one
 * page for a typical report, two when the test list is long.
 */
import { renderSectionsToPdf, type RenderedPdf } from '../pdf-kit/render-sections';
import type { Theme } from '../pdf-kit/theme';
import { certificateTitle, type CertificateDocument } from './certificate-document';
import type { CertificateSection } from './certificate-section';
import { CERTIFICATE_SECTIONS } from './certificate-sections';

/**
 * Renders the certificate and returns the PDF bytes and page count.
 * @example await renderCertificatePdf(buildCertificateDocument(report)) // { pdf, pageCount: 1 }
 */
export function renderCertificatePdf(
  cert: CertificateDocument,
  options: { sections?: readonly CertificateSection[]; theme?: Theme } = {},
): Promise<RenderedPdf> {
  const title = certificateTitle(cert.overallVerdict);
  const d = cert.device;
  const r = cert.report;
  return renderSectionsToPdf(cert, options.sections ?? CERTIFICATE_SECTIONS, {
    theme: options.theme,
    metadata: {
      title: `${title} ${cert.certificateNumber}`,
      author: cert.lab.name,
      subject: `${d.manufacturer} ${d.model}, serial ${d.serialNumber}; report ${r.reportNumber}`,
    },
    furniture: {
      headerLeft: cert.lab.name,
      headerRight: `Certificate ${cert.certificateNumber}`,
      footerLeft:
        `Certificate ${cert.certificateNumber}, ` +
        `refers to report ${r.reportNumber} revision ${r.revision}`,
    },
  });
}
