import { execFileSync } from 'node:child_process';
import { buildCertificateDocument } from '../../templates/certificate/certificate-document';
import {
  pdfPageCount,
  pdfPageTexts,
  pdfSignatureReport,
  renderPagesToPng,
  savePdfArtifact,
} from '../../templates/pdf-kit/pdf-inspection';
import { buildSampleReportDocument } from '../../templates/report/sample-report-document';
import { generateLabSigningIdentity } from './generate-lab-signing-identity';
import { renderSignedCertificate, renderSignedReport } from './render-signed-documents';

describe('renderSignedReport / renderSignedCertificate', () => {
  jest.setTimeout(60000);
  const identity = generateLabSigningIdentity({
    labName: 'Kestrelmoor Radio Test Laboratory',
    country: 'GB',
  });
  const report = buildSampleReportDocument();

  it.each([
    ['report', () => renderSignedReport(report, identity)],
    ['certificate', () => renderSignedCertificate(buildCertificateDocument(report), identity)],
  ])('%s: signed, hashed and counted consistently with independent tools', async (name, render) => {
    const signed = await render();
    const file = savePdfArtifact(`signed-${name}`, signed.pdf);
    // sha256sum (coreutils) as the independent hash.
    expect(signed.sha256).toBe(
      execFileSync('sha256sum', [file], { encoding: 'utf8' }).split(' ')[0],
    );
    expect(pdfPageCount(file)).toBe(signed.pageCount);
    expect(renderPagesToPng(file, `signed-${name}`)).toHaveLength(signed.pageCount);
    const sig = pdfSignatureReport(file);
    expect(sig).toContain('Signature Validation: Signature is Valid.');
    expect(sig).toContain('Total document signed');
    const pages = pdfPageTexts(file);
    pages.forEach(
      (text, i) => expect(text.replace(/\s+/g, ' ')).toContain(
        `Page ${i + 1} of ${signed.pageCount}`,
      ),
    );
  });

  it('names the authorizing person in the signature', async () => {
    const { pdf } = await renderSignedReport(report, identity);
    const sig = pdfSignatureReport(savePdfArtifact('signed-report-reason', pdf));
    expect(sig).toContain(`Signature Field Name: Signature1`);
    expect(pdf.toString('latin1')).toContain(`/Name (${report.authorizedBy.name})`);
    expect(pdf.toString('latin1')).toContain(
      `/Reason (Test report ${report.reportNumber} revision 0 authorized)`,
    );
  });
});
