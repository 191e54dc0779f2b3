/** Printed as the table of what was bought, and the total paid. */
import { drawTable } from '../../pdf-kit/table';
import { formatMoney } from '../format-money';
import { receiptTotalMinor } from '../receipt-document';
import type { ReceiptSection } from '../receipt-section';

export const receiptLinesSection: ReceiptSection = {
  id: 'lines',
  render(ctx, receipt) {
    const money = (minor: number) => formatMoney(minor, receipt.currency);
    ctx.gap(6);
    drawTable(ctx, {
      columns: [
        { header: 'Description', widthWeight: 5 },
        { header: 'Quantity', widthWeight: 1.2, align: 'right' },
        { header: 'Unit price', widthWeight: 2, align: 'right' },
        { header: 'Amount', widthWeight: 2, align: 'right' },
      ],
      rows: receipt.lines.map((l) => [
        l.description,
        String(l.quantity),
        money(l.unitPriceMinor),
        money(l.quantity * l.unitPriceMinor),
      ]),
      sizePt: ctx.theme.sizesPt.body,
    });
    ctx.text(`Total paid: ${money(receiptTotalMinor(receipt.lines))}`, {
      font: 'medium',
      sizePt: ctx.theme.sizesPt.subheading,
      align: 'right',
    });
    ctx.gap(12);
  },
};
