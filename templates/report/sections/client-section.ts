/** Printed as "Client": the customer's name, address and contact (ISO/IEC 17025:2017 7.8.2.1 e). */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReportSection } from '../report-section';

export const clientSection: ReportSection = {
  id: 'client',
  render(ctx, report) {
    ctx.heading('Client');
    const c = report.client;
    drawKeyValueList(ctx, [
      { label: 'Client', value: c.name },
      { label: 'Address', value: c.addressLines.join('\n') },
      { label: 'Contact', value: `${c.contactName}, ${c.contactEmail}` },
    ]);
  },
};
