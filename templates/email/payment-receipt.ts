/** Sent when a purchase of report credits is paid: to the person who paid, receipt PDF attached. */
import { renderEmail, type RenderedEmail } from './layout';
import { formatMoney } from '../receipt/format-money';

export function paymentReceiptEmail(input: {
  buyerName: string;
  labName: string;
  receiptNumber: string;
  credits: number;
  amountMinor: number;
  currency: string;
  balanceCredits: number;
  billingUrl: string;
}): RenderedEmail {
  const credits = `${input.credits} report credit${input.credits === 1 ? '' : 's'}`;
  const balance = `${input.balanceCredits} credit${input.balanceCredits === 1 ? '' : 's'}`;
  const amount = formatMoney(input.amountMinor, input.currency);
  return renderEmail({
    subject: `Receipt ${input.receiptNumber}: ${credits} from ${input.labName}`,
    paragraphs: [
      `Dear ${input.buyerName},`,
      `Thank you for your payment of ${amount} for ${credits} with ${input.labName}.`,
      `Your balance with ${input.labName} is now ${balance}; each credit pays for one report.`,
      `Receipt ${input.receiptNumber} is attached to this message as a PDF.`,
    ],
    action: { label: 'See your credits', url: input.billingUrl },
  });
}
