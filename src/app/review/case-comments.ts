import { ChangeDetectionStrategy, Component, effect, inject, input, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { COMMENT_MAX_LENGTH, ReviewApi, type CaseComment } from './review-api';
import { problemMessage } from '../session/problem-message';

const ROLE_WORDS: Record<CaseComment['authorRole'], string> = { reviewer: 'Reviewer', engineer: 'Engineer', 'lab-admin': 'Lab administrator' };

/** The review thread of one test case: what was said, by whom and when, and a box to add to it. */
@Component({
  selector: 'sc-case-comments',
  imports: [DatePipe, ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatInputModule],
  template: `
    <div class="thread" [attr.aria-label]="'Comments on ' + caseLabel()" role="region">
      <h3>Comments</h3>
      @if (loading()) {
        <p class="sc-muted">Loading comments…</p>
      } @else if (loadError(); as message) {
        <p class="sc-error-banner" role="alert">{{ message }} <button mat-button type="button" (click)="load()">Try again</button></p>
      } @else if (comments().length === 0) {
        <p class="sc-muted">No comments on this test case.</p>
      }
      <ol>
        @for (c of comments(); track c.id) {
          <li [attr.data-role]="c.authorRole">
            <div class="who"><strong>{{ c.authorName }}</strong> · {{ roleWords[c.authorRole] }} · <time [attr.datetime]="c.createdAt">{{ c.createdAt | date: 'd MMM y, HH:mm' }}</time></div>
            <p>{{ c.body }}</p>
          </li>
        }
      </ol>
      @if (canWrite()) {
        <form (submit)="$event.preventDefault(); send()" class="new">
          <mat-form-field>
            <mat-label>Add a comment</mat-label>
            <textarea matInput [formControl]="draft" rows="2" [attr.maxlength]="max"></textarea>
            <mat-hint align="end">{{ draftText().length }} / {{ max }}</mat-hint>
          </mat-form-field>
          <div class="send">
            <button mat-stroked-button type="submit" [disabled]="sending() || !draftText().trim()">Post comment</button>
            @if (sendError(); as message) {
              <span class="err" role="alert">{{ message }}</span>
            }
          </div>
        </form>
      }
    </div>
  `,
  styles: `
    h3 { font: 500 14px/1.3 Roboto, sans-serif; margin: 0 0 8px; }
    ol { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 8px; }
    li { border-left: 3px solid var(--sc-line); padding: 4px 0 4px 12px; font-size: 14px; }
    li[data-role='reviewer'] { border-left-color: #c98a00; }
    li[data-role='engineer'] { border-left-color: #2f7fb5; }
    .who { font-size: 12px; color: var(--sc-muted); }
    p { margin: 2px 0 0; white-space: pre-wrap; }
    .new { margin-top: 12px; display: flex; flex-direction: column; gap: 4px; }
    .new mat-form-field { width: 100%; }
    .send { display: flex; align-items: center; gap: 12px; }
    .err { color: var(--sc-fail); font-size: 13px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseComments {
  private readonly api = inject(ReviewApi);

  readonly runId = input.required<string>();
  readonly caseId = input.required<string>();
  readonly caseLabel = input.required<string>();
  readonly canWrite = input(true);

  protected readonly roleWords = ROLE_WORDS;
  protected readonly max = COMMENT_MAX_LENGTH;
  protected readonly comments = signal<CaseComment[]>([]);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  protected readonly sending = signal(false);
  protected readonly sendError = signal<string | null>(null);
  protected readonly draft = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(COMMENT_MAX_LENGTH)] });
  /** The draft as a signal, so the counter and the button follow typing under OnPush. */
  protected readonly draftText = toSignal(this.draft.valueChanges, { initialValue: '' });

  constructor() {
    effect(() => this.fetch(this.runId(), this.caseId()));
  }

  load(): void {
    this.fetch(this.runId(), this.caseId());
  }

  send(): void {
    const body = this.draft.value.trim();
    if (!body) return;
    this.sending.set(true);
    this.sendError.set(null);
    this.api.addComment(this.runId(), this.caseId(), body).subscribe({
      next: (c) => {
        this.comments.update((list) => [...list, c]);
        this.draft.reset('');
        this.sending.set(false);
      },
      error: (e) => {
        this.sendError.set(problemMessage(e));
        this.sending.set(false);
      },
    });
  }

  private fetch(runId: string, caseId: string): void {
    this.loading.set(true);
    this.loadError.set(null);
    this.api.comments(runId, caseId).subscribe({
      next: (answer) => {
        this.comments.set(answer.items);
        this.loading.set(false);
      },
      error: (e) => {
        this.loadError.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }
}
