import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { SessionStore } from '../session/session-store';
import { problemMessage } from '../session/problem-message';
import { SCREEN_ROLES } from '../accounts/screen-roles';
import { CalibrationChip } from './calibration-chip';
import { EquipmentApi, type Instrument } from './equipment-api';

const FILTERS = [
  { value: '', label: 'All' },
  { value: 'valid', label: 'Valid' },
  { value: 'due-soon', label: 'Due within 30 days' },
  { value: 'overdue', label: 'Overdue' },
];

/** The equipment register: each instrument with its calibration due date and status, soonest due first. */
@Component({
  selector: 'sc-equipment-page',
  imports: [DatePipe, FormsModule, RouterLink, MatButtonModule, MatButtonToggleModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule, MatProgressBarModule, MatSortModule, MatTableModule, CalibrationChip],
  templateUrl: './equipment-page.html',
  styles: `
    .filters { display: flex; gap: 16px; align-items: center; flex-wrap: wrap; margin-bottom: 16px; }
    .search { flex: 1 1 260px; max-width: 420px; }
    .table-card { padding: 0; overflow: hidden; position: relative; }
    table { width: 100%; }
    .small { font-size: 12px; }
    td.mat-column-serialNumber, td.mat-column-calibrationDue, td.mat-column-status { white-space: nowrap; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquipmentPage {
  private readonly api = inject(EquipmentApi);
  private readonly session = inject(SessionStore);

  protected readonly canWrite = this.session.hasRole(...SCREEN_ROLES.labRecordsWrite);
  protected readonly filters = FILTERS;
  protected readonly columns = ['name', 'serialNumber', 'certificateRef', 'calibrationDue', 'status', 'actions'];
  protected readonly rows = signal<Instrument[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly status = signal('');
  protected search = '';
  protected pageSize = 25;
  private pageIndex = 0;
  private sort = 'calibrationDue';

  constructor() {
    this.load();
  }

  selectStatus(value: string): void {
    this.status.set(value);
    this.pageIndex = 0;
    this.load();
  }

  changePage(event: PageEvent): void {
    this.pageIndex = event.pageIndex;
    this.pageSize = event.pageSize;
    this.load();
  }

  changeSort(sort: Sort): void {
    this.sort = sort.direction ? `${sort.direction === 'desc' ? '-' : ''}${sort.active}` : 'calibrationDue';
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.list({ page: this.pageIndex + 1, pageSize: this.pageSize, sort: this.sort, status: this.status(), search: this.search.trim() }).subscribe({
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
