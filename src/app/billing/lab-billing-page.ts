import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { formatMoney } from '../../../templates/receipt/format-money';
import { LabBillingApi, type Adjustment, type ClientBalance, type SalesOverview } from './billing-api';
import { AdjustmentDialog } from './adjustment-dialog';
import { ClientLedger } from './client-ledger';
import { PriceListEditor } from './price-list-editor';
import { problemMessage } from '../session/problem-message';

/**
 * The lab's sales of report credits: what its clients bought, each client's balance with its
 * statement, manual adjustments with a reason, and the price list clients buy from.
 */
@Component({
  selector: 'sc-lab-billing-page',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatPaginatorModule, MatProgressBarModule, ClientLedger, PriceListEditor],
  templateUrl: './lab-billing-page.html',
  styleUrl: './lab-billing-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabBillingPage {
  private readonly api = inject(LabBillingApi);
  private readonly dialog = inject(MatDialog);

  protected readonly sales = signal<SalesOverview | null>(null);
  protected readonly loading = signal(true);
  protected readonly error = signal<string | null>(null);
  protected readonly notice = signal<string | null>(null);
  protected readonly selected = signal<ClientBalance | null>(null);
  protected readonly ledgerVersion = signal(0);
  protected search = '';
  protected pageSize = 25;
  protected pageIndex = 0;

  constructor() {
    this.load();
  }

  load(): void {
    this.loading.set(true);
    this.error.set(null);
    this.api.sales({ page: this.pageIndex + 1, pageSize: this.pageSize, search: this.search.trim(), sort: 'name' }).subscribe({
      next: (s) => {
        this.sales.set(s);
        this.loading.set(false);
        // Keep the open statement's figures in step with the list.
        const open = this.selected();
        if (open) this.selected.set(s.clients.items.find((c) => c.clientId === open.clientId) ?? open);
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

  showStatement(client: ClientBalance): void {
    this.selected.set(client);
  }

  adjust(client: ClientBalance): void {
    this.notice.set(null);
    this.dialog
      .open<AdjustmentDialog, ClientBalance, Adjustment>(AdjustmentDialog, { data: client, autoFocus: 'first-tabbable' })
      .afterClosed()
      .subscribe((adjustment) => {
        if (!adjustment) return;
        const n = Math.abs(adjustment.credits);
        this.notice.set(`${adjustment.credits > 0 ? 'Added' : 'Took away'} ${n} ${n === 1 ? 'credit' : 'credits'} ${adjustment.credits > 0 ? 'to' : 'from'} ${client.name}; the balance is now ${adjustment.balance}.`);
        this.selected.set({ ...client, balance: adjustment.balance });
        this.ledgerVersion.update((v) => v + 1);
        this.load();
      });
  }

  money(minor: number, currency: string): string {
    return formatMoney(minor, currency);
  }
}
