/** Printed as how it was paid, the balance it brings, and what the receipt is (and is not). */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReceiptSection } from '../receipt-section';

export const receiptPaymentSection: ReceiptSection = {
  id: 'payment',
  render(ctx, receipt) {
    const p = receipt.payment;
    const held = `${receipt.balanceAfterCredits} with ${receipt.seller.name}`;
    drawKeyValueList(ctx, [
      { label: 'Payment', value: p.method },
      { label: 'Payment reference', value: p.reference },
      ...(p.paidBy ? [{ label: 'Paid by', value: p.paidBy }] : []),
      ...(receipt.balanceAfterCredits === undefined
        ? []
        : [{ label: 'Report credits now held', value: held }]),
    ]);
    ctx.gap(10);
    ctx.paragraph(
      'This receipt confirms a payment already received for report credits. Each credit pays ' +
        `for one test report issued by ${receipt.seller.name} to ${receipt.buyer.name}. ` +
        'It is not a tax invoice.',
      { sizePt: ctx.theme.sizesPt.small, color: ctx.theme.colors.muted },
    );
  },
};
