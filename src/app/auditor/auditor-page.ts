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
import { AuditorApi, type GrantedReport } from './auditor-api';
import { saveBlob } from './save-blob';
import { problemMessage } from '../session/problem-message';

const STATUS_WORDS: Record<GrantedReport['status'], string> = { current: 'Current', withdrawn: 'Withdrawn', superseded: 'Superseded' };

/** The auditor's view: the issued reports labs have granted them, read-only, with their status. */
@Component({
  selector: 'sc-auditor-page',
  imports: [DatePipe, FormsModule, RouterLink, MatTableModule, MatPaginatorModule, MatSortModule, MatButtonModule, MatIconModule, MatFormFieldModule, MatInputModule, MatProgressBarModule],
  templateUrl: './auditor-page.html',
  styleUrl: './auditor-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditorPage {
  private readonly api = inject(AuditorApi);
  protected readonly columns = ['reportNumber', 'lab', 'device', 'client', 'status', 'issuedAt', 'actions'];
  protected readonly rows = signal<GrantedReport[]>([]);
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

  statusWord(row: GrantedReport): string {
    return STATUS_WORDS[row.status] ?? row.status;
  }

  download(row: GrantedReport): void {
    this.downloading.set(row.id);
    this.api.pdf(row.id).subscribe({
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
