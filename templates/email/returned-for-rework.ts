/** Sent when a reviewer returns a test run to the bench: to the engineer who submitted it, with the reason. */
import { renderEmail, type RenderedEmail } from './layout';

export function returnedForReworkEmail(input: {
  engineerName: string;
  labName: string;
  runNumber: string;
  deviceLabel: string;
  reviewerName: string;
  reason: string;
  /** The run's workspace, e.g. https://sidecheck.example/runs/<id>. */
  runUrl: string;
}): RenderedEmail {
  return renderEmail({
    subject: `Run ${input.runNumber} was returned for rework: ${input.deviceLabel}`,
    paragraphs: [
      `Dear ${input.engineerName},`,
      `${input.reviewerName} has returned test run ${input.runNumber} of ${input.deviceLabel} to the bench at ${input.labName}.`,
      `Reason: ${input.reason}`,
      'Make the changes on the run, then submit it for review again.',
    ],
    action: { label: 'Open the run', url: input.runUrl },
  });
}
