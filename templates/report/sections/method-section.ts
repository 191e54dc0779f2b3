/**
 * Printed as "Method": the rule set with its version and each referenced document with clause and
 * edition (ISO/IEC 17025:2017 7.8.2.1 f).
 */
import { drawTable } from '../../pdf-kit/table';
import type { ReportSection } from '../report-section';

export const methodSection: ReportSection = {
  id: 'method',
  render(ctx, report) {
    ctx.heading('Method');
    const m = report.method;
    ctx.paragraph(
      `Tests were performed to the rule set "${m.ruleSetName}", version ${m.ruleSetVersion}, ` +
        'which applies the documents below.',
    );
    drawTable(ctx, {
      columns: [
        { header: 'Document', widthWeight: 3 },
        { header: 'Clause', widthWeight: 1.2 },
        { header: 'Edition', widthWeight: 1.2 },
      ],
      rows: m.references.map((r) => [r.document, r.clause ?? 'Whole document', r.edition]),
    });
  },
};
