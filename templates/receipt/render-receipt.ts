/** Printed as the PDF receipt of a purchase of report credits: one A4 page. */
import { renderSectionsToPdf, type RenderedPdf } from '../pdf-kit/render-sections';
import type { ReceiptDocument } from './receipt-document';
import { RECEIPT_SECTIONS } from './receipt-sections';

/**
 * Renders the receipt and returns the PDF bytes and page count. Errors of the drawing layer
 * (an unknown currency, a line without quantity) are rethrown naming the section.
 * @example await renderReceiptPdf(buildSampleReceipt())
 *   // { pdf: <Buffer 25 50 44 46 ...>, pageCount: 1 }
 */
export function renderReceiptPdf(receipt: ReceiptDocument): Promise<RenderedPdf> {
  return renderSectionsToPdf(receipt, RECEIPT_SECTIONS, {
    metadata: {
      title: `Receipt ${receipt.receiptNumber}`,
      author: receipt.seller.name,
      subject: `Report credits bought by ${receipt.buyer.name}`,
      creationDate: new Date(receipt.issuedAt),
    },
    furniture: {
      headerLeft: receipt.seller.name,
      headerRight: `Receipt ${receipt.receiptNumber}`,
      footerLeft: `Receipt ${receipt.receiptNumber}, issued through Sidecheck`,
    },
  });
}
