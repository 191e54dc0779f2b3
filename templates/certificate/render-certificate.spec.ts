import {
  pdfPageCount,
  pdfPageTexts,
  renderPagesToPng,
  savePdfArtifact,
} from '../pdf-kit/pdf-inspection';
import { buildSampleReportDocument } from '../report/sample-report-document';
import { buildSampleResults } from '../report/sample-report-results';
import { buildCertificateDocument, certificateTitle } from './certificate-document';
import { renderCertificatePdf } from './render-certificate';

jest.setTimeout(60000);
const flat = (s: string) => s.replace(/\s+/g, ' ');

describe('compliance certificate', () => {
  const report = buildSampleReportDocument();

  it('fits one page for the sample and refers to the full report by number and revision', async () => {
    const cert = buildCertificateDocument(report);
    const { pdf, pageCount } = await renderCertificatePdf(cert);
    const file = savePdfArtifact('certificate-spec-sample', pdf);
    expect(pageCount).toBe(1);
    expect(pdfPageCount(file)).toBe(1);
    expect(renderPagesToPng(file, 'certificate-spec-sample')).toHaveLength(1);
    const text = flat(pdfPageTexts(file)[0]);
    for (const s of [
      'Certificate of compliance',
      'KRT-2025-0142-C',
      'test report KRT-2025-0142, revision 0',
      report.device.serialNumber,
      report.device.model,
      report.client.name,
      'Unwanted sideband suppression',
      'Conditional pass',
      'Overall verdict:',
      report.verificationUrl,
      report.authorizedBy.name,
      'Signature',
      'Page 1 of 1',
      'End of certificate',
    ]) {
      expect(text).toContain(s);
    }
  });

  it('summarises one line per test, not per test point', () => {
    const cert = buildCertificateDocument(report);
    expect(cert.tests.map((t) => t.testName)).toEqual(
      [...new Set(report.results.map((r) => r.testName))],
    );
    expect(cert.tests.find((t) => t.testName === 'Carrier suppression')?.testPointCount).toBe(2);
  });

  it('stays within two pages for a long list of tests', async () => {
    const results = buildSampleResults({
      count: 45,
      plotCount: 0,
    }).map((r, i) => ({ ...r, testName: `Test ${i + 1}` }));
    const { pageCount } = await renderCertificatePdf(
      buildCertificateDocument(buildSampleReportDocument({ results })),
    );
    expect(pageCount).toBe(2);
  });

  it('is titled a summary, not a certificate of compliance, when a test failed', async () => {
    const results = buildSampleResults();
    results[0] = { ...results[0], verdict: 'fail', margin: -3 };
    const cert = buildCertificateDocument(buildSampleReportDocument({ results }));
    expect(cert.overallVerdict).toBe('fail');
    expect(certificateTitle(cert.overallVerdict)).toBe('Summary of conformity assessment');
    const file = savePdfArtifact('certificate-spec-fail', (await renderCertificatePdf(cert)).pdf);
    const text = flat(pdfPageTexts(file).join(' '));
    expect(text).toContain('Summary of conformity assessment');
    expect(text).not.toContain('Certificate of compliance');
  });

  it('refuses a report without results', () => {
    expect(() => buildCertificateDocument(buildSampleReportDocument({ results: [] }))).toThrow(
      /^buildCertificateDocument: /,
    );
  });
});
