/** Sent when a lab issues a report: to the client's contact, with links to download and verify. */
import { renderEmail, type RenderedEmail } from './layout';

export function reportIssuedEmail(input: {
  contactName: string;
  labName: string;
  reportNumber: string;
  deviceLabel: string;
  verdictSummary: string;
  downloadUrl: string;
  verifyUrl: string;
  attached: boolean;
}): RenderedEmail {
  return renderEmail({
    subject: `Test report ${input.reportNumber} issued for ${input.deviceLabel}`,
    paragraphs: [
      `Dear ${input.contactName},`,
      `${input.labName} has issued test report ${input.reportNumber} for ${input.deviceLabel}.`,
      `Summary: ${input.verdictSummary}.`,
      input.attached ? 'The signed report is attached to this message.' : 'Sign in to Sidecheck to download the signed report.',
      `Anyone you share the report with can check that it is authentic and current at ${input.verifyUrl}`,
    ],
    action: { label: 'Download the report', url: input.downloadUrl },
    footnote: 'The results relate only to the item tested.',
  });
}
