import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { CaseComments } from './case-comments';

describe('CaseComments', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render(canWrite = true) {
    const fixture = TestBed.createComponent(CaseComments);
    fixture.componentRef.setInput('runId', 'run-1');
    fixture.componentRef.setInput('caseId', 'case-1');
    fixture.componentRef.setInput('caseLabel', 'Carrier at 2182 kHz');
    fixture.componentRef.setInput('canWrite', canWrite);
    fixture.detectChanges();
    return fixture;
  }

  const comment = (body: string, authorRole: 'reviewer' | 'engineer') => ({ id: body, runId: 'run-1', testCaseId: 'case-1', authorId: 'u', authorName: authorRole === 'reviewer' ? 'Priya C' : 'Tomasz E', authorRole, body, createdAt: '2026-11-02T09:30:00Z' });

  it('shows the thread with who said what, and appends a posted comment', async () => {
    const fixture = await render();
    http.expectOne('/api/runs/run-1/cases/case-1/comments').flush({ items: [comment('Which RBW?', 'reviewer')] });
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.textContent).toContain('Priya C · Reviewer');
    expect(el.textContent).toContain('Which RBW?');
    const box = el.querySelector('textarea')!;
    box.value = '  10 Hz.  ';
    box.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    const post = http.expectOne({ method: 'POST', url: '/api/runs/run-1/cases/case-1/comments' });
    // Surrounding spaces are trimmed before sending.
    expect(post.request.body).toEqual({ body: '10 Hz.' });
    post.flush(comment('10 Hz.', 'engineer'));
    await fixture.whenStable();
    expect(el.querySelectorAll('li')).toHaveLength(2);
    expect(box.value).toBe('');
  });

  it('shows the server’s refusal beside the box, and an empty thread as such', async () => {
    const fixture = await render();
    http.expectOne('/api/runs/run-1/cases/case-1/comments').flush({ items: [] });
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.textContent).toContain('No comments on this test case.');
    const box = el.querySelector('textarea')!;
    box.value = 'Late remark';
    box.dispatchEvent(new Event('input'));
    await fixture.whenStable();
    (el.querySelector('button[type="submit"]') as HTMLButtonElement).click();
    http.expectOne({ method: 'POST', url: '/api/runs/run-1/cases/case-1/comments' }).flush({ detail: 'Run RUN-000001 is issued, so its review threads are closed.' }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(el.querySelector('[role="alert"]')!.textContent).toContain('review threads are closed');
  });

  it('offers no box to someone who may only read', async () => {
    const fixture = await render(false);
    http.expectOne('/api/runs/run-1/cases/case-1/comments').flush({ items: [] });
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('textarea')).toBeNull();
  });
});
