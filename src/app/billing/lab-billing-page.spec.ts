import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { MatDialog } from '@angular/material/dialog';
import { of } from 'rxjs';
import { LabBillingPage } from './lab-billing-page';
import type { ClientBalance, LedgerEntry, SalesOverview } from './billing-api';

jest.setTimeout(20_000);

const halyard: ClientBalance = { clientId: 'c1', name: 'Halyard Radio', invoiceLater: false, balance: 3, purchased: 5, consumed: 2, refunded: 0, adjusted: 0, lastActivityAt: '2026-12-01T10:00:00Z' };
const overview = (clients: ClientBalance[], totals: SalesOverview['totals'] = []): SalesOverview => ({ totals, clients: { items: clients, total: clients.length, page: 1, pageSize: 25 } });
const entry = (credits: number, balanceAfter: number, kind: LedgerEntry['kind'], reason: string | null = null): LedgerEntry => ({
  id: `l${balanceAfter}`, kind, credits, reason, reportId: null, reportNumber: kind === 'consumption' ? 'KBR-2026-0001' : null, purchaseId: null, createdByName: 'Owen Achterberg',
  lab: { id: 'lab', name: 'Lab' }, client: { id: 'c1', name: 'Halyard Radio' }, balanceAfter, createdAt: '2026-12-01T10:00:00Z',
});

describe('LabBillingPage', () => {
  let http: HttpTestingController;
  let dialogAnswer: unknown;
  beforeEach(() => {
    dialogAnswer = undefined;
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), { provide: MatDialog, useValue: { open: () => ({ afterClosed: () => of(dialogAnswer) }) } }],
    });
    http = TestBed.inject(HttpTestingController);
  });

  async function render(sales: SalesOverview) {
    const fixture = TestBed.createComponent(LabBillingPage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/billing/sales').flush(sales);
    http.expectOne('/api/billing/price-list').flush({ configured: false, currency: null, packs: [], refundOnWithdrawWithinDays: null, updatedAt: null });
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  it('shows revenue per currency and each client’s balance', async () => {
    // formatMoney: 80 000 pence = GBP 800.00 (GBP has 2 decimals, ISO 4217 from memory).
    const { el } = await render(overview([halyard], [{ currency: 'GBP', completedPurchases: 1, revenueMinor: 80000, creditsSold: 5, pendingPurchases: 0 }]));
    expect(el.querySelector('.totals')!.textContent).toContain('GBP 800.00');
    expect(el.querySelector('.totals')!.textContent).toContain('5 credits in 1 purchase');
    const row = el.querySelector('table[aria-label="Clients and their credit balances"] tbody tr')!;
    expect(row.textContent).toContain('Halyard Radio');
    expect(row.querySelector('.balance')!.textContent!.trim()).toBe('3');
  });

  it('says so when the lab has no clients and no sales', async () => {
    const { el } = await render(overview([]));
    expect(el.textContent).toContain('No clients yet');
    expect(el.textContent).toContain('No client has bought credits online yet.');
  });

  it('shows the error with a way to try again', async () => {
    const fixture = TestBed.createComponent(LabBillingPage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/billing/sales').flush({ detail: 'Database unavailable.' }, { status: 503, statusText: 'Unavailable' });
    http.expectOne('/api/billing/price-list').flush({ configured: false, currency: null, packs: [], refundOnWithdrawWithinDays: null, updatedAt: null });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('.clients .sc-error-banner[role="alert"]')!.textContent).toContain('Database unavailable.');
    (el.querySelector('.clients .sc-error-banner button') as HTMLButtonElement).click();
    http.expectOne((r) => r.url === '/api/billing/sales');
  });

  it('opens a client’s statement, and after an adjustment shows the new balance and reads the statement again', async () => {
    const { el, fixture } = await render(overview([halyard]));
    (el.querySelector('button[aria-label="Statement of Halyard Radio"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    const ledger = http.expectOne((r) => r.url === '/api/billing/ledger');
    expect(ledger.request.params.get('clientId')).toBe('c1');
    ledger.flush({ items: [entry(-1, 3, 'consumption'), entry(4, 4, 'adjustment', 'Starting balance')], total: 2, page: 1, pageSize: 10 });
    await fixture.whenStable();
    const statement = el.querySelector('table[aria-label="Credit statement of Halyard Radio"]')!;
    expect(statement.textContent).toContain('KBR-2026-0001');
    expect(statement.textContent).toContain('Starting balance');
    expect(statement.textContent).toContain('−1');

    dialogAnswer = { id: 'l9', clientId: 'c1', kind: 'adjustment', credits: 2, reason: 'Goodwill', createdAt: '2026-12-05T10:00:00Z', balance: 5 };
    (el.querySelector('button[aria-label="Adjust credits of Halyard Radio"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    expect(el.querySelector('.sc-notice[role="status"]')!.textContent).toContain('Added 2 credits to Halyard Radio; the balance is now 5.');
    http.expectOne((r) => r.url === '/api/billing/ledger').flush({ items: [], total: 0, page: 1, pageSize: 10 });
    http.expectOne((r) => r.url === '/api/billing/sales').flush(overview([{ ...halyard, balance: 5, adjusted: 2 }]));
    await fixture.whenStable();
    expect(el.querySelector('tbody tr .balance')!.textContent!.trim()).toBe('5');
  });
});
