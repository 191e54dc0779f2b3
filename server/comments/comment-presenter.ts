import type { RunComment } from '../db/models';

/** A comment as the API shows it: plain data with the author's name as it reads today. */
export function presentComment(c: RunComment, authorName: string) {
  return {
    id: c.id,
    runId: c.runId,
    testCaseId: c.testCaseId,
    authorId: c.authorId,
    authorName,
    authorRole: c.authorRole,
    body: c.body,
    createdAt: c.createdAt.toISOString(),
  };
}
