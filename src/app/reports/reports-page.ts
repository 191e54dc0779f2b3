import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ReportsApi, type ReportRow } from './reports-api';
import { problemMessage } from '../session/problem-message';
import { VerdictChip } from '../ui/verdict-chip';

@Component({
  selector: 'sc-reports-page',
  imports: [DatePipe, FormsModule, RouterLink, MatTableModule, MatPaginatorModule, MatSortModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, VerdictChip],
  templateUrl: './reports-page.html',
  styleUrl: './reports-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReportsPage {
  private readonly api = inject(ReportsApi);
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
