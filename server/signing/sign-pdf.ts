/**
 * Signs a finished PDF with the lab's identity: an incremental update adds an invisible signature
 * field with a /Contents placeholder (@signpdf/placeholder-plain), then @signpdf/signpdf fills in
 * a detached CMS signature (SubFilter adbe.pkcs7.detached, SHA-256 digest, ISO 32000-1 12.8)
 * over every byte except the placeholder. Any later byte change breaks the digest; appended
 * bytes leave the signature valid but no longer covering the whole document.
 */
import { plainAddPlaceholder } from '@signpdf/placeholder-plain';
import { P12Signer } from '@signpdf/signer-p12';
import { SignPdf } from '@signpdf/signpdf';
import { identityToPkcs12 } from './identity-to-pkcs12';
import type { LabSigningIdentity } from './lab-signing-identity';

export interface SignPdfOptions {
  /** Why it is signed, shown by PDF readers (default "Authorized test report"). */
  reason?: string;
  /** Where it is signed, usually the lab's town (default empty). */
  location?: string;
  /** The signer's name as shown by readers (default "Authorized signatory"). */
  name?: string;
  /** Contact of the signer, usually the lab's e-mail (default empty). */
  contactInfo?: string;
  /** Signing time (default now). */
  signingTime?: Date;
}

/** Bytes reserved for the CMS signature: a 3072-bit key, its certificate and a short chain fit. */
const SIGNATURE_LENGTH = 8192;

/**
 * Returns the signed PDF. Input that is not a PDF throws a RangeError; a key that does not match
 * the certificate throws a RangeError (from identityToPkcs12).
 * @example await signPdf(pdf, identity, { reason: 'Report KRT-2025-0142 authorized' })
 *   // <Buffer 25 50 44 46 ...> (the input plus an incremental update with the signature)
 */
export async function signPdf(
  pdf: Buffer,
  identity: LabSigningIdentity,
  options: SignPdfOptions = {},
): Promise<Buffer> {
  if (!Buffer.isBuffer(pdf) || pdf.subarray(0, 5).toString('latin1') !== '%PDF-') {
    throw new RangeError('signPdf: input is not a PDF file');
  }
  const { p12Der, passphrase } = identityToPkcs12(identity);
  const withPlaceholder = plainAddPlaceholder({
    pdfBuffer: pdf,
    reason: options.reason ?? 'Authorized test report',
    location: options.location ?? '',
    name: options.name ?? 'Authorized signatory',
    contactInfo: options.contactInfo ?? '',
    signatureLength: SIGNATURE_LENGTH,
    ...(options.signingTime ? { signingTime: options.signingTime } : {}),
  });
  const signer = new P12Signer(p12Der, { passphrase });
  return new SignPdf().sign(withPlaceholder, signer, options.signingTime);
}
