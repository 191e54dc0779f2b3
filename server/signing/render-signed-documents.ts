/**
 * The server's entry points for issued documents: render the report or the certificate, sign it
 * with the lab's identity and return the bytes with their SHA-256 (stored for verification) and
 * page count.
 */
import { renderCertificatePdf } from '../../templates/certificate/render-certificate';
import type { CertificateDocument } from '../../templates/certificate/certificate-document';
import type { ReportDocument } from '../../templates/report/report-document';
import { renderReportPdf } from '../../templates/report/render-report';
import type { LabSigningIdentity } from './lab-signing-identity';
import { sha256Hex } from './sha256-hex';
import { signPdf, type SignPdfOptions } from './sign-pdf';

export interface SignedPdf {
  pdf: Buffer;
  /** SHA-256 hex of `pdf`, the exact bytes issued. */
  sha256: string;
  pageCount: number;
}

/**
 * Renders and signs a test report; the signature names the authorizing person and the lab.
 * @example const { pdf, sha256, pageCount } = await renderSignedReport(report, identity);
 */
export async function renderSignedReport(
  report: ReportDocument,
  identity: LabSigningIdentity,
  options: SignPdfOptions = {},
): Promise<SignedPdf> {
  const { pdf, pageCount } = await renderReportPdf(report);
  const signed = await signPdf(pdf, identity, {
    reason: `Test report ${report.reportNumber} revision ${report.revision} authorized`,
    name: report.authorizedBy.name,
    location: report.lab.name,
    contactInfo: report.lab.email ?? '',
    ...options,
  });
  return { pdf: signed, sha256: sha256Hex(signed), pageCount };
}

/**
 * Renders and signs a compliance certificate (build it with buildCertificateDocument).
 * @example await renderSignedCertificate(buildCertificateDocument(report), identity)
 *   // { pdf, sha256, pageCount: 1 }
 */
export async function renderSignedCertificate(
  cert: CertificateDocument,
  identity: LabSigningIdentity,
  options: SignPdfOptions = {},
): Promise<SignedPdf> {
  const { pdf, pageCount } = await renderCertificatePdf(cert);
  const signed = await signPdf(pdf, identity, {
    reason: `Certificate ${cert.certificateNumber} authorized`,
    name: cert.authorizedBy.name,
    location: cert.lab.name,
    contactInfo: cert.lab.email ?? '',
    ...options,
  });
  return { pdf: signed, sha256: sha256Hex(signed), pageCount };
}
