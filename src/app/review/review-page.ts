import { ChangeDetectionStrategy, Component, computed, effect, inject, input, signal } from '@angular/core';
import { HttpErrorResponse } from '@angular/common/http';
import { KeyValuePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RunsApi, type RunDetail } from '../runs/runs-api';
import { ReasonDialog, type ReasonDialogData } from '../reports/reason-dialog';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';
import { StateBadge } from '../ui/state-badge';
import { CaseReview } from './case-review';

type Outcome = { kind: 'done' | 'four-eyes' | 'error'; text: string };

/**
 * The technical reviewer's view of a run (ISO/IEC 17025:2017 7.8.1.1: a second competent person
 * checks the results before they are reported): every case with its inputs, files, budget and
 * comments, and the two decisions — return it to the bench with a reason, or authorize it.
 */
@Component({
  selector: 'sc-review-page',
  imports: [KeyValuePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, StateBadge, CaseReview],
  templateUrl: './review-page.html',
  styleUrl: './review-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewPage {
  private readonly runs = inject(RunsApi);
  private readonly dialog = inject(MatDialog);
  protected readonly session = inject(SessionStore);

  readonly id = input.required<string>();
  protected readonly run = signal<RunDetail | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly acting = signal(false);
  protected readonly outcome = signal<Outcome | null>(null);

  protected readonly isReviewer = computed(() => this.session.hasRole('reviewer', 'lab-admin'));
  protected readonly inReview = computed(() => this.run()?.state === 'in-review');
  protected readonly canDecide = computed(() => this.inReview() && this.isReviewer());
  protected readonly canIssue = computed(() => this.run()?.state === 'approved' && this.isReviewer());
  /** Threads stay open until the run is issued (server/comments). */
  protected readonly canComment = computed(() => ['testing', 'in-review', 'approved'].includes(this.run()?.state ?? '') && this.session.hasRole('reviewer', 'engineer', 'lab-admin'));
  protected readonly instrumentText = computed(() => (this.run()?.instruments ?? []).map((i) => `${i.name} (calibration due ${i.calibrationDue})`).join(', ') || 'none recorded');
  protected readonly verdictCounts = computed(() => {
    const counts: Record<string, number> = {};
    for (const c of this.run()?.testCases ?? []) {
      const v = (c.result ?? c.traceResult)?.verdict ?? 'not-evaluated';
      counts[v] = (counts[v] ?? 0) + 1;
    }
    return counts;
  });

  constructor() {
    effect(() => this.load(this.id()));
  }

  load(id: string): void {
    this.loading.set(true);
    this.error.set(null);
    this.runs.get(id).subscribe({
      next: (run) => {
        this.run.set(run);
        this.loading.set(false);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }

  returnToBench(): void {
    const run = this.run();
    if (!run) return;
    const data: ReasonDialogData = {
      title: `Return ${run.number} to the bench`,
      intro: 'The engineer sees your reason at the top of the run and can measure again, then send it back for review.',
      label: 'Reason for returning',
      confirm: 'Return to the bench',
    };
    this.dialog.open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, { data }).afterClosed().subscribe((reason) => {
      if (reason) this.decide('return', reason, 'Returned to the bench with your reason.');
    });
  }

  authorize(): void {
    this.decide('approve', undefined, 'Results authorized. The report can now be issued.');
  }

  issue(): void {
    this.decide('issue', undefined, 'Report issued and signed. The client has been notified by e-mail.');
  }

  private decide(action: 'return' | 'approve' | 'issue', reason: string | undefined, done: string): void {
    const run = this.run();
    if (!run) return;
    this.acting.set(true);
    this.outcome.set(null);
    this.runs.act(run.id, action, reason).subscribe({
      next: () => {
        this.acting.set(false);
        this.outcome.set({ kind: 'done', text: done });
        this.load(run.id);
      },
      error: (e) => {
        this.acting.set(false);
        // The four-eyes refusal (403 on approve) is the rule working, not a fault: shown as such.
        const fourEyes = action === 'approve' && e instanceof HttpErrorResponse && e.status === 403;
        this.outcome.set({ kind: fourEyes ? 'four-eyes' : 'error', text: problemMessage(e) });
      },
    });
  }
}
