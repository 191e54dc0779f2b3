/** The receipt as an ordered list of sections (one file each under sections/). */
import type { ReceiptSection } from './receipt-section';
import { receiptHeadingSection } from './sections/receipt-heading-section';
import { receiptPartiesSection } from './sections/receipt-parties-section';
import { receiptLinesSection } from './sections/receipt-lines-section';
import { receiptPaymentSection } from './sections/receipt-payment-section';

export const RECEIPT_SECTIONS: readonly ReceiptSection[] = [
  receiptHeadingSection,
  receiptPartiesSection,
  receiptLinesSection,
  receiptPaymentSection,
];
