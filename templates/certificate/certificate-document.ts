/**
 * Printed as the compliance certificate: the plain data it takes, derived from a report by
 * {@link buildCertificateDocument}. The certificate summarises the verdict per test and always
 * refers to the full report by number and revision.
 */
import type { ReportDocument, ReportVerdict } from '../report/report-document';
import {
  overallVerdict,
  summariseVerdicts,
  type TestVerdictSummary,
} from '../report/summarise-verdicts';

export interface CertificateDocument {
  certificateNumber: string;
  /** The full report this certificate summarises. */
  report: { reportNumber: string; revision: number; issued: string; title: string };
  lab: ReportDocument['lab'];
  client: { name: string; addressLines: string[] };
  device: ReportDocument['device'];
  method: { ruleSetName: string; ruleSetVersion: string };
  decisionRule: string;
  /** Worst verdict per test, in report order. */
  tests: TestVerdictSummary[];
  overallVerdict: ReportVerdict;
  /** Date of issue of the certificate (ISO 8601). */
  issued: string;
  authorizedBy: ReportDocument['authorizedBy'];
  verificationUrl: string;
}

export interface CertificateOptions {
  /** Defaults to the report number followed by "-C". */
  certificateNumber?: string;
  /** Defaults to the report's verification address. */
  verificationUrl?: string;
  /** Defaults to the report's date of issue. */
  issued?: string;
}

/**
 * Builds the certificate data from a report. A report without results throws a RangeError (a
 * certificate must state at least one verdict).
 * @example buildCertificateDocument(buildSampleReportDocument()).certificateNumber
 *   // 'KRT-2025-0142-C'
 */
export function buildCertificateDocument(
  report: ReportDocument,
  options: CertificateOptions = {},
): CertificateDocument {
  if (report.results.length === 0) {
    throw new RangeError('buildCertificateDocument: the report has no results to certify');
  }
  return {
    certificateNumber: options.certificateNumber ?? `${report.reportNumber}-C`,
    report: {
      reportNumber: report.reportNumber,
      revision: report.revision,
      issued: report.dates.issued,
      title: report.title,
    },
    lab: report.lab,
    client: { name: report.client.name, addressLines: report.client.addressLines },
    device: report.device,
    method: {
      ruleSetName: report.method.ruleSetName,
      ruleSetVersion: report.method.ruleSetVersion,
    },
    decisionRule: report.decisionRule,
    tests: summariseVerdicts(report.results),
    overallVerdict: overallVerdict(report.results),
    issued: options.issued ?? report.dates.issued,
    authorizedBy: report.authorizedBy,
    verificationUrl: options.verificationUrl ?? report.verificationUrl,
  };
}

/**
 * The certificate's title: "Certificate of compliance" only when every evaluated test passed
 * (conditional passes included, as the decision rule allows); otherwise it is a summary of the
 * assessment and says so.
 */
export function certificateTitle(verdict: ReportVerdict): string {
  return verdict === 'pass' || verdict === 'conditional-pass'
    ? 'Certificate of compliance'
    : 'Summary of conformity assessment';
}
