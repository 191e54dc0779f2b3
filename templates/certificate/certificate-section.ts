/** A part of the certificate: an id and a renderer (see certificate-sections.ts for the list). */
import type { DocumentSection } from '../pdf-kit/render-sections';
import type { CertificateDocument } from './certificate-document';

export type CertificateSection = DocumentSection<CertificateDocument>;
