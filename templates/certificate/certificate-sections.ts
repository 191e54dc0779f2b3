/** The compliance certificate as an ordered list of sections (one file each under sections/). */
import type { CertificateSection } from './certificate-section';
import { certificateHeadingSection } from './sections/certificate-heading-section';
import { certificateIdentificationSection } from './sections/certificate-identification-section';
import { certificateSignoffSection } from './sections/certificate-signoff-section';
import { certificateVerdictsSection } from './sections/certificate-verdicts-section';

export const CERTIFICATE_SECTIONS: readonly CertificateSection[] = [
  certificateHeadingSection,
  certificateIdentificationSection,
  certificateVerdictsSection,
  certificateSignoffSection,
];
