/** Printed as who was paid (the lab) and who paid (its client). */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReceiptSection } from '../receipt-section';

export const receiptPartiesSection: ReceiptSection = {
  id: 'parties',
  render(ctx, receipt) {
    const { seller, buyer } = receipt;
    drawKeyValueList(ctx, [
      { label: 'Received by', value: [seller.name, ...seller.addressLines].join(', ') },
      { label: 'Received from', value: [buyer.name, ...buyer.addressLines].join(', ') },
      ...(buyer.contactName ? [{ label: 'Contact', value: buyer.contactName }] : []),
    ]);
  },
};
