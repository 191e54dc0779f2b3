/** Printed as "Test conditions": environment and operation (ISO/IEC 17025:2017 7.8.3.1 a). */
import { drawKeyValueList } from '../../pdf-kit/key-value-list';
import type { ReportSection } from '../report-section';

export const conditionsSection: ReportSection = {
  id: 'conditions',
  render(ctx, report) {
    ctx.heading('Test conditions');
    if (report.conditions.length === 0) ctx.paragraph('No conditions recorded.');
    else drawKeyValueList(ctx, report.conditions);
  },
};
