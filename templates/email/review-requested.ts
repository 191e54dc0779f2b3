/** Sent when an engineer submits a test run for technical review: to the lab's reviewers, with a link to the review screen. */
import { renderEmail, type RenderedEmail } from './layout';

export function reviewRequestedEmail(input: {
  reviewerName: string;
  labName: string;
  runNumber: string;
  deviceLabel: string;
  clientName: string;
  submittedByName: string;
  /** The review screen, e.g. https://sidecheck.example/runs/<id>/review. */
  reviewUrl: string;
}): RenderedEmail {
  return renderEmail({
    subject: `Run ${input.runNumber} is ready for review: ${input.deviceLabel}`,
    paragraphs: [
      `Dear ${input.reviewerName},`,
      `${input.submittedByName} has submitted test run ${input.runNumber} of ${input.deviceLabel} for ${input.clientName} for technical review at ${input.labName}.`,
      'Check the readings, the results and the equipment used, then authorize the run or return it to the bench with a reason.',
    ],
    action: { label: 'Review the run', url: input.reviewUrl },
    footnote: 'Whoever took readings on the run cannot authorize it; another reviewer must.',
  });
}
