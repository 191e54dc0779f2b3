/**
 * Sent when a lab issues a report and the client has one report credit or none left with that
 * lab: to the client's contact.
 */
import { renderEmail, type RenderedEmail } from './layout';

export function lowCreditEmail(input: {
  contactName: string;
  clientName: string;
  labName: string;
  balanceCredits: number;
  billingUrl: string;
}): RenderedEmail {
  const n = input.balanceCredits;
  const left = n === 1 ? 'one report credit' : n <= 0 ? 'no report credits' : `${n} report credits`;
  return renderEmail({
    subject: `${input.clientName} has ${left} left with ${input.labName}`,
    paragraphs: [
      `Dear ${input.contactName},`,
      `${input.labName} has just issued a test report for ${input.clientName}, which used one ` +
        `report credit. ${input.clientName} now has ${left} left with ${input.labName}.`,
      input.balanceCredits <= 0
        ? `The next report can be issued once credits have been bought.`
        : `Buy more credits before the next report is due so that it is issued without delay.`,
    ],
    action: { label: 'Buy report credits', url: input.billingUrl },
  });
}
