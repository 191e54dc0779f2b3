import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ReportsApi, type ReportRow } from '../reports/reports-api';
import { groupReportsByLab } from './group-reports-by-lab';
import { saveBlob } from '../auditor/save-blob';
import { problemMessage } from '../session/problem-message';
import { VerdictChip } from '../ui/verdict-chip';
import { CreditBalances } from './credit-balances';

/** Reports fetched at once: the API's largest page; more than that is the reports table's job. */
const PAGE = 200;
const STATUS_WORDS: Record<ReportRow['status'], string> = { current: 'Current', withdrawn: 'Withdrawn', superseded: 'Superseded' };

/** The manufacturer's landing page: their devices and reports from each lab, and their credits. */
@Component({
  selector: 'sc-portal-page',
  imports: [DatePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, VerdictChip, CreditBalances],
  templateUrl: './portal-page.html',
  styleUrl: './portal-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PortalPage {
  private readonly reports = inject(ReportsApi);
  protected readonly words = STATUS_WORDS;
  protected readonly rows = signal<ReportRow[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly downloading = signal<string | null>(null);
  protected readonly labs = computed(() => groupReportsByLab(this.rows()));
  protected readonly pageSize = PAGE;

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.reports.list({ page: 1, pageSize: PAGE, sort: '-issuedAt' }).subscribe({
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

  verdictOf(row: ReportRow): string {
    const v = row.summary.verdicts ?? [];
    for (const worst of ['fail', 'conditional-fail', 'conditional-pass']) if (v.includes(worst)) return worst;
    return v.length ? 'pass' : 'not-evaluated';
  }

  download(row: ReportRow): void {
    this.downloading.set(row.id);
    this.reports.pdf(row.id).subscribe({
      next: (blob) => {
        saveBlob(blob, `${row.reportNumber}-rev${row.revision}.pdf`);
        this.downloading.set(null);
      },
      error: (e) => {
        this.error.set(problemMessage(e));
        this.downloading.set(null);
      },
    });
  }
}
