import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

export interface CaseComment {
  id: string;
  runId: string;
  testCaseId: string;
  authorId: string;
  authorName: string;
  authorRole: 'lab-admin' | 'engineer' | 'reviewer';
  body: string;
  createdAt: string;
}

/** The longest comment the server accepts (server/comments/comment-body-schema.ts). */
export const COMMENT_MAX_LENGTH = 4000;

/** Typed access to the review threads: GET/POST /api/runs/:id/cases/:caseId/comments. */
@Injectable({ providedIn: 'root' })
export class ReviewApi {
  private readonly http = inject(HttpClient);

  comments(runId: string, caseId: string): Observable<{ items: CaseComment[] }> {
    return this.http.get<{ items: CaseComment[] }>(this.path(runId, caseId));
  }

  addComment(runId: string, caseId: string, body: string): Observable<CaseComment> {
    return this.http.post<CaseComment>(this.path(runId, caseId), { body });
  }

  private path(runId: string, caseId: string): string {
    return `/api/runs/${encodeURIComponent(runId)}/cases/${encodeURIComponent(caseId)}/comments`;
  }
}
