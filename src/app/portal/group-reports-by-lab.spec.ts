import { groupReportsByLab } from './group-reports-by-lab';
import type { ReportRow } from '../reports/reports-api';

let n = 0;
const report = (lab: string | undefined, device: string | undefined, serialNumber: string, issuedAt: string, status: ReportRow['status'] = 'current'): ReportRow => ({
  id: `r${++n}`,
  runId: 'run',
  reportNumber: `N-${n}`,
  revision: 1,
  sha256: 'x',
  pageCount: 4,
  summary: { lab, device, serialNumber },
  issuedAt,
  status,
  verifyPath: '/verify/x',
});

// Arrangement rules are the portal's own (common practice for a document register): lab, then device, newest first.
describe('groupReportsByLab', () => {
  it('groups by lab (A to Z), then device and serial, newest report first', () => {
    const rows = [
      report('Kestrel Bay', 'Halyard HX-90', 'B-2', '2026-10-01T00:00:00Z'),
      report('Albatross Labs', 'Halyard HX-90', 'A-1', '2026-09-01T00:00:00Z'),
      report('Kestrel Bay', 'Halyard HX-90', 'A-1', '2026-08-01T00:00:00Z', 'superseded'),
      report('Kestrel Bay', 'Halyard HX-90', 'A-1', '2026-11-01T00:00:00Z'),
    ];
    const groups = groupReportsByLab(rows);
    expect(groups.map((g) => g.lab)).toEqual(['Albatross Labs', 'Kestrel Bay']);
    expect(groups[1].devices.map((d) => d.serialNumber)).toEqual(['A-1', 'B-2']);
    expect(groups[1].devices[0].reports.map((r) => r.issuedAt.slice(0, 10))).toEqual(['2026-11-01', '2026-08-01']);
    // The superseded one does not count as current.
    expect(groups[1].currentCount).toBe(2);
  });

  it('sorts serial numbers as people read them (2 before 10) and names missing fields', () => {
    const groups = groupReportsByLab([report('L', 'D', 'SN-10', '2026-01-01T00:00:00Z'), report('L', 'D', 'SN-2', '2026-01-01T00:00:00Z'), report(undefined, undefined, '', '2026-01-01T00:00:00Z')]);
    expect(groups.map((g) => g.lab)).toEqual(['L', 'Unnamed laboratory']);
    expect(groups[0].devices.map((d) => d.serialNumber)).toEqual(['SN-2', 'SN-10']);
    expect(groups[1].devices[0]).toMatchObject({ device: 'Unnamed device', serialNumber: '—' });
  });

  it('gives nothing for no reports', () => {
    expect(groupReportsByLab([])).toEqual([]);
  });
});
