import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatDialog } from '@angular/material/dialog';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ReportsApi, type ReportRow } from './reports-api';
import { ReasonDialog, type ReasonDialogData } from './reason-dialog';
import { RevisionHistoryDialog } from './revision-history-dialog';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { VerdictChip } from '../ui/verdict-chip';

@Component({
  selector: 'sc-reports-page',
  imports: [DatePipe, FormsModule, RouterLink, MatTableModule, MatPaginatorModule, MatSortModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatMenuModule, MatProgressBarModule, VerdictChip],
  templateUrl: './reports-page.html',
  styleUrl: './reports-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportsPage {
  private readonly api = inject(ReportsApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly session = inject(SessionStore);
  /** Withdrawal and correction belong to the issuing lab's reviewers and administrators. */
  protected readonly canAmend = () => this.session.membership()?.kind === 'lab' && this.session.hasRole('lab-admin', 'reviewer');
  protected readonly notice = signal<string | null>(null);
  protected readonly acting = signal<string | null>(null);
  protected readonly columns = ['reportNumber', 'device', 'client', 'verdicts', 'status', 'issuedAt', 'actions'];
  protected readonly rows = signal<ReportRow[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly downloading = signal<string | null>(null);
  protected search = '';
  protected pageSize = 25;
  private pageIndex = 0;
  private sort = '-issuedAt';

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.list({ page: this.pageIndex + 1, pageSize: this.pageSize, sort: this.sort, search: this.search.trim() }).subscribe({
      next: (p) => {
        this.rows.set(p.items);
        this.total.set(p.total);
        this.loading.set(false);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.loading.set(false);
      },
    });
  }

  changePage(e: PageEvent): void {
    this.pageIndex = e.pageIndex;
    this.pageSize = e.pageSize;
    this.load();
  }

  changeSort(s: Sort): void {
    this.sort = s.direction ? `${s.direction === 'desc' ? '-' : ''}${s.active}` : '-issuedAt';
    this.load();
  }

  applySearch(): void {
    this.pageIndex = 0;
    this.load();
  }

  verdictOf(row: ReportRow): string {
    const v = row.summary.verdicts ?? [];
    if (v.includes('fail')) return 'fail';
    if (v.includes('conditional-fail')) return 'conditional-fail';
    if (v.includes('conditional-pass')) return 'conditional-pass';
    return v.length ? 'pass' : 'not-evaluated';
  }

  history(row: ReportRow): void {
    this.dialog.open(RevisionHistoryDialog, { data: { reportNumber: row.reportNumber }, autoFocus: 'dialog' });
  }

  withdraw(row: ReportRow): void {
    const data: ReasonDialogData = {
      title: `Withdraw ${row.reportNumber} revision ${row.revision}`,
      intro: 'The report stays on record, marked withdrawn with your reason; its verification page will say so at once. This cannot be undone.',
      label: 'Reason for withdrawal',
      confirm: 'Withdraw the report',
      warn: true,
    };
    this.dialog.open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, { data }).afterClosed().subscribe((reason) => {
      if (!reason) return;
      this.acting.set(row.id);
      this.api.withdraw(row.id, reason).subscribe({
        next: () => {
          this.acting.set(null);
          this.notice.set(`${row.reportNumber} revision ${row.revision} is withdrawn.`);
          this.load();
        },
        error: (e) => {
          this.acting.set(null);
          this.error.set(problemMessage(e));
        },
      });
    });
  }

  correct(row: ReportRow): void {
    const data: ReasonDialogData = {
      title: `Correct ${row.reportNumber}`,
      intro: `The run goes back on the bench for the correction. Issuing it again makes revision ${row.revision + 1}, which states that it replaces revision ${row.revision} and why (ISO/IEC 17025:2017 7.8.8).`,
      label: 'What needs correcting',
      confirm: 'Reopen for correction',
    };
    this.dialog.open<ReasonDialog, ReasonDialogData, string>(ReasonDialog, { data }).afterClosed().subscribe((reason) => {
      if (!reason) return;
      this.acting.set(row.id);
      this.api.revise(row.runId, reason).subscribe({
        next: () => {
          this.acting.set(null);
          void this.router.navigate(['/runs', row.runId]);
        },
        error: (e) => {
          this.acting.set(null);
          this.error.set(problemMessage(e));
        },
      });
    });
  }

  statusText(row: ReportRow): string {
    // Re-issuing always makes the next revision of the same number (server/reports/report-service.ts).
    if (row.status === 'superseded') return `Superseded by rev. ${row.revision + 1}`;
    if (row.status === 'withdrawn') return 'Withdrawn';
    return row.revision > 1 ? `Current · replaces rev. ${row.revision - 1}` : 'Current';
  }

  download(row: ReportRow): void {
    this.downloading.set(row.id);
    this.api.pdf(row.id).subscribe({
      next: (blob) => {
        const url = URL.createObjectURL(blob);
        const a = document.createElement('a');
        a.href = url;
        a.download = `${row.reportNumber}-rev${row.revision}.pdf`;
        a.click();
        setTimeout(() => URL.revokeObjectURL(url), 10_000);
        this.downloading.set(null);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.downloading.set(null);
      },
    });
  }
}
