/** Printed at the top of the receipt: the seller, the word "Receipt", its number and dates. */
import type { ReceiptSection } from '../receipt-section';

export const receiptHeadingSection: ReceiptSection = {
  id: 'heading',
  render(ctx, receipt) {
    const { theme } = ctx;
    ctx.text(receipt.seller.name, { font: 'medium', sizePt: 12, color: theme.colors.accent });
    const { seller } = receipt;
    const contact = [...seller.addressLines, seller.email ?? '', seller.phone ?? ''];
    ctx.text(contact.filter(Boolean).join('  \u2022  '), {
      sizePt: theme.sizesPt.small,
      color: theme.colors.muted,
    });
    ctx.gap(18);
    ctx.text('Receipt', { font: 'medium', sizePt: theme.sizesPt.title });
    ctx.gap(2);
    const paid = receipt.paidAt.slice(0, 10);
    const dates = `paid ${paid}   \u2022   issued ${receipt.issuedAt.slice(0, 10)}`;
    ctx.text(`No. ${receipt.receiptNumber}   \u2022   ${dates}`, { color: theme.colors.muted });
    ctx.gap(14);
  },
};
