import { ChangeDetectionStrategy, Component, effect, inject, input, signal, untracked } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { LabBillingApi, type LedgerEntry } from './billing-api';
import { problemMessage } from '../session/problem-message';

const KIND_LABELS: Record<LedgerEntry['kind'], string> = { purchase: 'Purchase', consumption: 'Report issued', refund: 'Refund', adjustment: 'Adjustment' };

/** One client's credit statement: every ledger row, newest first, with the balance after it. */
@Component({
  selector: 'sc-client-ledger',
  imports: [DatePipe, MatButtonModule, MatPaginatorModule, MatProgressBarModule],
  templateUrl: './client-ledger.html',
  styleUrl: './client-ledger.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClientLedger {
  private readonly api = inject(LabBillingApi);

  readonly clientId = input.required<string>();
  readonly clientName = input.required<string>();
  /** Bumped by the page after a change (an adjustment), to read the statement again. */
  readonly version = input(0);

  protected readonly rows = signal<LedgerEntry[]>([]);
  protected readonly total = signal(0);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly kindLabels = KIND_LABELS;
  protected pageSize = 10;
  protected pageIndex = 0;

  constructor() {
    effect(() => {
      this.clientId();
      this.version();
      untracked(() => {
        this.pageIndex = 0;
        this.load();
      });
    });
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.ledger(this.clientId(), { page: this.pageIndex + 1, pageSize: this.pageSize }).subscribe({
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

  signed(n: number): string {
    return n > 0 ? `+${n}` : `${n}`.replace('-', '−');
  }
}
