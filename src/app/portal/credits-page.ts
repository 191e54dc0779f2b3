import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { DatePipe, DOCUMENT } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { formatMoney } from '../../../templates/receipt/format-money';
import { BillingApi, type CreditOffer, type CreditPack, type Purchase } from './billing-api';
import { saveBlob } from '../auditor/save-blob';
import { problemMessage } from '../session/problem-message';
import { SessionStore } from '../session/session-store';

/** How long to wait for the provider's webhook after the buyer comes back, and how often to look. */
const CONFIRM_TRIES = 30;
const CONFIRM_EVERY_MS = 1000;

/**
 * Buying report credits: the balance at each lab with its packs, the provider's hosted payment page
 * (the browser goes there and comes back to /billing?checkout=…&purchase=…), the outcome on return,
 * and every purchase with its receipt. Credits are added only when the provider confirms the payment
 * to the server, so on return the page waits for that rather than trusting the redirect.
 */
@Component({
  selector: 'sc-credits-page',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatPaginatorModule, MatProgressBarModule],
  templateUrl: './credits-page.html',
  styleUrl: './credits-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CreditsPage {
  private readonly api = inject(BillingApi);
  private readonly document = inject(DOCUMENT);
  private readonly session = inject(SessionStore);

  /** Set by the payment page's return address. */
  readonly checkout = input<string | undefined>();
  readonly purchase = input<string | undefined>();

  protected readonly offers = signal<CreditOffer[] | null>(null);
  protected readonly offersError = signal<string | null>(null);
  protected readonly buying = signal<string | null>(null);
  protected readonly buyError = signal<string | null>(null);
  protected readonly outcome = signal<{ state: 'waiting' | 'done' | 'failed'; text: string } | null>(null);
  protected readonly purchases = signal<Purchase[]>([]);
  protected readonly purchasesTotal = signal(0);
  protected readonly purchasesLoading = signal(true);
  protected readonly purchasesError = signal<string | null>(null);
  protected readonly canBuy = computed(() => this.session.hasRole('manufacturer-admin'));
  protected readonly totalCredits = computed(() => (this.offers() ?? []).reduce((n, o) => n + o.balance, 0));
  protected pageSize = 10;
  private pageIndex = 0;
  private timer: ReturnType<typeof setTimeout> | null = null;

  constructor() {
    inject(DestroyRef).onDestroy(() => this.timer && clearTimeout(this.timer));
    this.loadOffers();
    this.loadPurchases();
    // The return address's query string arrives as inputs; look at it once.
    let looked = false;
    effect(() => {
      const checkout = this.checkout();
      const id = this.purchase();
      if (looked) return;
      looked = true;
      untracked(() => this.checkReturn(checkout, id));
    });
  }

  price(pack: CreditPack): string {
    return formatMoney(pack.priceMinor, pack.currency);
  }

  perCredit(pack: CreditPack): string {
    return formatMoney(pack.pricePerCreditMinor, pack.currency);
  }

  buy(offer: CreditOffer, pack: CreditPack): void {
    this.buying.set(`${offer.lab.id}:${pack.id}`);
    this.buyError.set(null);
    this.api.checkout(offer.lab.id, pack.id).subscribe({
      next: ({ url }) => this.leaveFor(url),
      error: (e) => {
        this.buyError.set(problemMessage(e));
        this.buying.set(null);
      },
    });
  }

  /** The hosted payment page is the provider's; the browser leaves the app and comes back to /billing. */
  protected leaveFor(url: string): void {
    this.document.location.assign(url);
  }

  changePage(e: PageEvent): void {
    this.pageIndex = e.pageIndex;
    this.pageSize = e.pageSize;
    this.loadPurchases();
  }

  receipt(p: Purchase): void {
    this.api.receipt(p).subscribe({ next: (blob) => saveBlob(blob, `${p.receiptNumber}.pdf`), error: (e) => this.purchasesError.set(problemMessage(e)) });
  }

  loadOffers(): void {
    this.offersError.set(null);
    this.api.offers().subscribe({ next: (o) => this.offers.set(o.items), error: (e) => this.offersError.set(problemMessage(e)) });
  }

  loadPurchases(): void {
    this.purchasesLoading.set(true);
    this.purchasesError.set(null);
    this.api.purchases({ page: this.pageIndex + 1, pageSize: this.pageSize }).subscribe({
      next: (p) => {
        this.purchases.set(p.items);
        this.purchasesTotal.set(p.total);
        this.purchasesLoading.set(false);
      },
      error: (e) => {
        this.purchasesError.set(problemMessage(e));
        this.purchasesLoading.set(false);
      },
    });
  }

  private checkReturn(checkout: string | undefined, id: string | undefined): void {
    if (!id || !checkout) return;
    if (checkout === 'cancelled') {
      this.outcome.set({ state: 'failed', text: 'You left the payment page before paying. Nothing was charged and no credits were added.' });
      return;
    }
    this.outcome.set({ state: 'waiting', text: 'Confirming your payment with the payment provider…' });
    this.poll(id, CONFIRM_TRIES);
  }

  private poll(id: string, triesLeft: number): void {
    this.api.purchase(id).subscribe({
      next: (p) => {
        if (p.status === 'pending' && !p.message.includes('did not go through') && triesLeft > 1) {
          this.timer = setTimeout(() => this.poll(id, triesLeft - 1), CONFIRM_EVERY_MS);
          return;
        }
        this.outcome.set({ state: p.status === 'completed' ? 'done' : 'failed', text: p.message });
        this.loadOffers();
        this.loadPurchases();
      },
      error: (e) => this.outcome.set({ state: 'failed', text: problemMessage(e) }),
    });
  }
}
