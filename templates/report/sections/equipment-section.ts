/** Printed as "Equipment used": each instrument with identification and calibration due date. */
import { drawTable } from '../../pdf-kit/table';
import type { ReportSection } from '../report-section';

export const equipmentSection: ReportSection = {
  id: 'equipment',
  render(ctx, report) {
    ctx.heading('Equipment used');
    if (report.equipment.length === 0) {
      ctx.paragraph('No equipment recorded.');
      return;
    }
    drawTable(ctx, {
      columns: [
        { header: 'Equipment', widthWeight: 3 },
        { header: 'Model', widthWeight: 2 },
        { header: 'Serial number', widthWeight: 1.6 },
        { header: 'Calibration due', widthWeight: 1.3 },
      ],
      rows: report.equipment.map((e) => [e.name, e.model, e.serialNumber, e.calibrationDue]),
    });
  },
};
