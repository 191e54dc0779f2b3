import type { ReportRow } from './reports-api';

export interface RevisionLink {
  id: string;
  revision: number;
  status: ReportRow['status'];
  issuedAt: string;
  verifyPath: string;
  /** "Supersedes revision 1", "Superseded by revision 3", or null for a first revision still alone. */
  relation: string | null;
}

/**
 * The revisions of one report number, newest first, each with how it relates to its neighbours.
 * Re-issuing a reopened run always makes the next revision and supersedes the one before
 * (ISO/IEC 17025:2017 7.8.8: the new report says what it replaces), so the chain is the rows of
 * that number in revision order. Rows of other numbers (a search also matches devices) are
 * ignored. Pure; an unknown number gives an empty chain.
 * @example revisionChain(rows, 'KBRTL-2026-0001').map((r) => r.relation)
 * // ['Supersedes revision 1', 'Superseded by revision 2']
 */
export function revisionChain(rows: readonly ReportRow[], reportNumber: string): RevisionLink[] {
  const chain = rows.filter((r) => r.reportNumber === reportNumber).sort((a, b) => b.revision - a.revision);
  return chain.map((r, i) => {
    const newer = chain[i - 1];
    const older = chain[i + 1];
    const relation = r.status === 'superseded' && newer ? `Superseded by revision ${newer.revision}` : older ? `Supersedes revision ${older.revision}` : null;
    return { id: r.id, revision: r.revision, status: r.status, issuedAt: r.issuedAt, verifyPath: r.verifyPath, relation };
  });
}
