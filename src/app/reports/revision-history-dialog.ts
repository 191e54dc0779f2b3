import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatButtonModule } from '@angular/material/button';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { forkJoin, map, of, switchMap } from 'rxjs';
import { ReportsApi } from './reports-api';
import { revisionChain, type RevisionLink } from './revision-chain';
import { problemMessage } from '../session/problem-message';

const STATUS_WORDS = { current: 'Current', withdrawn: 'Withdrawn', superseded: 'Superseded' } as const;

/** Every revision of one report number, with the reason each was withdrawn or replaced. */
@Component({
  selector: 'sc-revision-history-dialog',
  imports: [DatePipe, RouterLink, MatDialogModule, MatButtonModule, MatProgressBarModule],
  template: `
    <h2 mat-dialog-title>Revisions of {{ data.reportNumber }}</h2>
    <mat-dialog-content>
      @if (loading()) {
        <mat-progress-bar mode="indeterminate" aria-label="Loading the revisions" />
      }
      @if (error(); as message) {
        <p class="sc-error-banner" role="alert">{{ message }}</p>
      }
      <ol class="chain">
        @for (r of chain(); track r.id) {
          <li [attr.data-status]="r.status">
            <div><strong>Revision {{ r.revision }}</strong> · {{ words[r.status] }} · issued {{ r.issuedAt | date: 'd MMM y' }}</div>
            @if (r.relation) {
              <div class="sc-muted">{{ r.relation }}</div>
            }
            @if (r.reason) {
              <div class="reason">Reason: {{ r.reason }}</div>
            }
            <a mat-dialog-close [routerLink]="r.verifyPath">Verification page</a>
          </li>
        }
      </ol>
    </mat-dialog-content>
    <mat-dialog-actions align="end"><button mat-button mat-dialog-close>Close</button></mat-dialog-actions>
  `,
  styles: `
    .chain { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 12px; min-width: min(440px, 80vw); }
    li { border-left: 3px solid var(--sc-pass); padding-left: 12px; font-size: 14px; display: flex; flex-direction: column; gap: 2px; }
    li[data-status='superseded'], li[data-status='withdrawn'] { border-left-color: var(--sc-fail); }
    .reason { font-size: 13px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RevisionHistoryDialog {
  protected readonly data = inject<{ reportNumber: string }>(MAT_DIALOG_DATA);
  private readonly api = inject(ReportsApi);
  protected readonly words = STATUS_WORDS;
  protected readonly chain = signal<(RevisionLink & { reason: string | null })[]>([]);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.api
      .list({ page: 1, pageSize: 100, sort: '-issuedAt', search: this.data.reportNumber })
      .pipe(
        map((page) => revisionChain(page.items, this.data.reportNumber)),
        // The reason sits on each report's latest status change (GET /api/reports/:id).
        switchMap((chain) => (chain.length ? forkJoin(chain.map((link) => this.api.get(link.id).pipe(map((d) => ({ ...link, reason: d.reason }))))) : of([]))),
      )
      .subscribe({
        next: (chain) => {
          this.chain.set(chain);
          this.loading.set(false);
        },
        error: (e) => {
          this.error.set(problemMessage(e));
          this.loading.set(false);
        },
      });
  }
}
