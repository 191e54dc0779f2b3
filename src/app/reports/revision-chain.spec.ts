import { revisionChain } from './revision-chain';
import type { ReportRow } from './reports-api';

const row = (reportNumber: string, revision: number, status: ReportRow['status']): ReportRow => ({
  id: `${reportNumber}-r${revision}`,
  runId: 'run',
  reportNumber,
  revision,
  sha256: 'x',
  pageCount: 3,
  summary: {},
  issuedAt: `2026-11-0${revision}T10:00:00Z`,
  status,
  verifyPath: `/verify/t${revision}`,
});

// Common practice for amended reports (ISO/IEC 17025:2017 7.8.8): each revision replaces the one before.
describe('revisionChain', () => {
  it('lists the revisions newest first with what each supersedes or is superseded by', () => {
    const rows = [row('LAB-2026-0001', 1, 'superseded'), row('LAB-2026-0001', 3, 'current'), row('LAB-2026-0001', 2, 'superseded')];
    expect(revisionChain(rows, 'LAB-2026-0001').map((r) => [r.revision, r.relation])).toEqual([
      [3, 'Supersedes revision 2'],
      [2, 'Superseded by revision 3'],
      [1, 'Superseded by revision 2'],
    ]);
  });

  it('says nothing about a first revision that stands alone, and keeps a withdrawn last revision withdrawn', () => {
    expect(revisionChain([row('A-1', 1, 'current')], 'A-1')[0].relation).toBeNull();
    const chain = revisionChain([row('A-1', 1, 'superseded'), row('A-1', 2, 'withdrawn')], 'A-1');
    expect(chain[0]).toMatchObject({ revision: 2, status: 'withdrawn', relation: 'Supersedes revision 1' });
  });

  it('ignores other report numbers a search also found, and an unknown number gives nothing', () => {
    const rows = [row('A-1', 1, 'current'), row('A-10', 1, 'current')];
    expect(revisionChain(rows, 'A-1').map((r) => r.id)).toEqual(['A-1-r1']);
    expect(revisionChain(rows, 'B-2')).toEqual([]);
  });
});
