import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { BillingApi, type CreditAccount } from './billing-api';
import { problemMessage } from '../session/problem-message';

/** The manufacturer's report credits at each lab, with the way to buy more. */
@Component({
  selector: 'sc-credit-balances',
  imports: [RouterLink, MatButtonModule, MatIconModule],
  template: `
    <section class="sc-card credits" aria-labelledby="credits-title">
      <div class="head">
        <h2 id="credits-title">Report credits</h2>
        <a mat-flat-button routerLink="/billing"><mat-icon>add_card</mat-icon>Buy credits</a>
      </div>
      @if (error(); as message) {
        <p class="sc-error-banner" role="alert">{{ message }}</p>
      } @else if (accounts() === null) {
        <p class="sc-muted">Loading your balance…</p>
      } @else if (accounts()!.length === 0) {
        <p class="sc-muted">You are not a client of any laboratory yet.</p>
      } @else {
        <ul>
          @for (a of accounts(); track a.lab.id) {
            <li><span class="lab">{{ a.lab.name }}</span><span class="balance" [attr.data-low]="a.balance <= 0">{{ a.balance }} {{ a.balance === 1 ? 'credit' : 'credits' }}</span></li>
          }
        </ul>
      }
    </section>
  `,
  styles: `
    .credits { margin-bottom: 16px; }
    .head { display: flex; justify-content: space-between; align-items: center; gap: 12px; h2 { margin: 0; font: 500 17px/1.3 Roboto, sans-serif; } }
    ul { list-style: none; margin: 10px 0 0; padding: 0; display: flex; flex-wrap: wrap; gap: 8px 24px; }
    li { display: flex; gap: 10px; align-items: baseline; font-size: 14px; }
    .balance { font: 500 18px/1.2 Roboto, sans-serif; color: var(--sc-pass); }
    .balance[data-low='true'] { color: var(--sc-fail); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CreditBalances {
  private readonly api = inject(BillingApi);
  protected readonly accounts = signal<CreditAccount[] | null>(null);
  protected readonly error = signal<string | null>(null);

  constructor() {
    this.api.balance().subscribe({ next: (b) => this.accounts.set(b.items), error: (e) => this.error.set(problemMessage(e)) });
  }
}
