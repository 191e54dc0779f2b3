import fs from 'node:fs';
import { renderReportPdf } from '../../templates/report/render-report';
import { buildSampleReportDocument } from '../../templates/report/sample-report-document';
import { pdfSignatureReport, savePdfArtifact } from '../../templates/pdf-kit/pdf-inspection';
import { generateLabSigningIdentity } from './generate-lab-signing-identity';
import { importPkcs12 } from './import-pkcs12';
import { buildOpensslFixture } from './openssl-fixtures';
import { signPdf } from './sign-pdf';

// pdfsig (Poppler) is the independent verifier; it exits 0 in every case, so its text is read.
const VALID = 'Signature Validation: Signature is Valid.';

describe('signPdf', () => {
  jest.setTimeout(60000);
  const identity = generateLabSigningIdentity({
    labName: 'Kestrelmoor Radio Test Laboratory',
    country: 'GB',
  });
  let unsigned: Buffer;
  let signed: Buffer;
  let signedFile: string;

  beforeAll(async () => {
    unsigned = (await renderReportPdf(buildSampleReportDocument())).pdf;
    signed = await signPdf(
      unsigned,
      identity,
      {
        reason: 'Report KRT-2025-0142 authorized',
        name: 'Dr Ilse Marrow',
        location: 'Port Ellery',
      },
    );
    signedFile = savePdfArtifact('sign-pdf-spec-signed', signed);
  });

  it('produces a valid adbe.pkcs7.detached SHA-256 signature over the whole document', () => {
    const report = pdfSignatureReport(signedFile);
    expect(report).toContain(VALID);
    expect(report).toContain('Total document signed');
    expect(report).toContain('Signature Type: adbe.pkcs7.detached');
    expect(report).toContain('Signing Hash Algorithm: SHA-256');
    expect(report).toContain('Signer Certificate Common Name: Kestrelmoor Radio Test Laboratory');
    // Incremental update: the original bytes are kept unchanged at the start.
    expect(signed.subarray(0, unsigned.length).equals(unsigned)).toBe(true);
  });

  it('detects one changed byte inside the signed range', () => {
    const tampered = Buffer.from(signed);
    // A byte inside the first page's content, well inside the first signed range [0, placeholder).
    const at = Math.floor(unsigned.length / 2);
    tampered[at] ^= 0x20;
    const report = pdfSignatureReport(savePdfArtifact('sign-pdf-spec-tampered', tampered));
    expect(report).not.toContain(VALID);
    expect(report).toMatch(/Digest Mismatch\.|Signature is Invalid\./);
  });

  it('reports bytes appended after signing as not covering the whole document', () => {
    const appended = Buffer.concat([signed, Buffer.from('\n% appended after signing\n', 'latin1')]);
    const report = pdfSignatureReport(savePdfArtifact('sign-pdf-spec-appended', appended));
    expect(report).toContain('Not total document signed');
  });

  it('signs with a lab-uploaded PKCS#12 identity (with chain) as well', async () => {
    const fx = buildOpensslFixture();
    const uploaded = importPkcs12(fx.chainedP12, fx.passphrase);
    const file = savePdfArtifact('sign-pdf-spec-uploaded', await signPdf(unsigned, uploaded));
    const report = pdfSignatureReport(file);
    expect(report).toContain(VALID);
    expect(report).toContain('Signer Certificate Common Name: Uploaded Test Lab Signer');
    fs.rmSync(fx.dir, { recursive: true, force: true });
  });

  it('refuses input that is not a PDF and a key that does not match the certificate', async () => {
    await expect(signPdf(Buffer.from('hello'), identity)).rejects.toThrow(
      /^signPdf: input is not a PDF/,
    );
    const other = generateLabSigningIdentity({ labName: 'Other Lab', keyBits: 2048 });
    await expect(
      signPdf(
        unsigned,
        { certificatePem: identity.certificatePem, privateKeyPem: other.privateKeyPem },
      ),
    ).rejects.toThrow(
      /identityToPkcs12: the private key does not match/,
    );
  });
});
