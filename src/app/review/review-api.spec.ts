import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { ReviewApi, type CaseComment } from './review-api';

// The server's contract: /api/runs/:id/cases/:caseId/comments (server/review).
describe('ReviewApi', () => {
  let api: ReviewApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ReviewApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // An invented comment (test fixture).
  const comment: CaseComment = { id: 'cm-1', runId: 'run 1', testCaseId: 'case/1', authorId: 'u-3', authorName: 'Rhea Vance', authorRole: 'reviewer', body: 'Check the RBW.', createdAt: '2026-11-02T10:00:00Z' };

  it('lists a case’s comments, ids escaped in the path', async () => {
    const list = firstValueFrom(api.comments('run 1', 'case/1'));
    const req = http.expectOne('/api/runs/run%201/cases/case%2F1/comments');
    expect(req.request.method).toBe('GET');
    req.flush({ items: [comment] });
    expect((await list).items).toEqual([comment]);
  });

  it('adds a comment with its text as the body and hands back the stored one', async () => {
    const added = firstValueFrom(api.addComment('run-1', 'case-1', 'Check the RBW.'));
    const req = http.expectOne('/api/runs/run-1/cases/case-1/comments');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ body: 'Check the RBW.' });
    req.flush(comment);
    expect((await added).authorName).toBe('Rhea Vance');
  });
});
