import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { RouterLink } from '@angular/router';
import { FormsModule } from '@angular/forms';
import { MatTableModule } from '@angular/material/table';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RunsApi, type RunRow } from '../runs/runs-api';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';
import { StateBadge } from '../ui/state-badge';
import { HomePanels } from './home-panels';

const QUEUES = [
  { value: 'testing,draft', label: 'On the bench' },
  { value: 'in-review', label: 'Awaiting review' },
  { value: 'approved', label: 'Authorized' },
  { value: 'issued', label: 'Issued' },
  { value: '', label: 'All' },
];

@Component({
  selector: 'sc-home-page',
  imports: [DatePipe, RouterLink, FormsModule, MatTableModule, MatPaginatorModule, MatSortModule, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatInputModule, MatIconModule, MatProgressBarModule, StateBadge, HomePanels],
  templateUrl: './home-page.html',
  styleUrl: './home-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HomePage {
  private readonly runs = inject(RunsApi);
  protected readonly session = inject(SessionStore);

  protected readonly queues = QUEUES;
  protected readonly columns = ['number', 'model', 'client', 'state', 'updatedAt'];
  protected readonly rows = signal<RunRow[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly queue = signal(this.session.hasRole('reviewer') && !this.session.hasRole('engineer') ? 'in-review' : 'testing,draft');
  protected search = '';
  private pageIndex = 0;
  protected pageSize = 25;
  private sort = '-updatedAt';

  constructor() {
    this.load();
  }

  selectQueue(value: string): void {
    this.queue.set(value);
    this.pageIndex = 0;
    this.load();
  }

  changePage(event: PageEvent): void {
    this.pageIndex = event.pageIndex;
    this.pageSize = event.pageSize;
    this.load();
  }

  changeSort(sort: Sort): void {
    this.sort = sort.direction ? `${sort.direction === 'desc' ? '-' : ''}${sort.active}` : '-updatedAt';
    this.load();
  }

  applySearch(): void {
    this.pageIndex = 0;
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.runs.list({ page: this.pageIndex + 1, pageSize: this.pageSize, sort: this.sort, state: this.queue(), search: this.search.trim() }).subscribe({
      next: (page) => {
        this.rows.set(page.items);
        this.total.set(page.total);
        this.loading.set(false);
      },
      error: (error) => {
        this.error.set(problemMessage(error));
        this.loading.set(false);
      },
    });
  }
}
