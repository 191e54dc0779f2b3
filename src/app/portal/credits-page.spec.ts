import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { CreditsPage } from './credits-page';
import { SessionStore } from '../session/session-store';
import type { CreditOffer, Purchase } from './billing-api';

const offer = (balance: number): CreditOffer => ({
  lab: { id: 'lab-1', name: 'Kestrel Bay Radio Test Lab' }, clientId: 'c', clientName: 'Halyard', invoiceLater: false, balance, lastActivityAt: null,
  currency: 'GBP', packs: [{ id: 'pack-5', credits: 5, priceMinor: 45000, currency: 'GBP', pricePerCreditMinor: 9000 }],
});
const purchase = (status: Purchase['status'], message: string): Purchase => ({
  id: 'pur-1', lab: { id: 'lab-1', name: 'Kestrel Bay Radio Test Lab' }, client: { id: 'c', name: 'Halyard' }, packId: 'pack-5', credits: 5, amountMinor: 45000, currency: 'GBP', amountText: 'GBP 450.00',
  status, message, receiptNumber: status === 'completed' ? 'RC-0001' : null, receiptPath: status === 'completed' ? '/api/billing/purchases/pur-1/receipt' : null, createdAt: '2026-11-02T10:00:00Z', completedAt: null,
});

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('CreditsPage', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...roles) => roles.includes('manufacturer-admin'));
  });

  async function render(query: { checkout?: string; purchase?: string } = {}) {
    const fixture = TestBed.createComponent(CreditsPage);
    if (query.checkout) fixture.componentRef.setInput('checkout', query.checkout);
    if (query.purchase) fixture.componentRef.setInput('purchase', query.purchase);
    await fixture.whenStable();
    http.expectOne('/api/billing/offers').flush({ items: [offer(2)] });
    http.expectOne((r) => r.url === '/api/billing/purchases').flush({ items: [], total: 0, page: 1, pageSize: 10 });
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  it('shows the balance and each pack with its price, and sends the buyer to the provider’s page', async () => {
    const { el } = await render();
    expect(el.textContent).toContain('2 credits');
    // formatMoney: 45000 minor units of GBP (2 decimals, ISO 4217 from memory) = GBP 450.00; 9000 per credit.
    expect(el.textContent).toContain('GBP 450.00');
    expect(el.textContent).toContain('GBP 90.00 per credit');
    // jsdom's location cannot be replaced: watch the one method that leaves the app.
    const assign = jest.spyOn(CreditsPage.prototype as unknown as { leaveFor(url: string): void }, 'leaveFor').mockImplementation(() => undefined);
    (el.querySelector('button[aria-label^="Buy 5 credits"]') as HTMLButtonElement).click();
    const req = http.expectOne({ method: 'POST', url: '/api/billing/checkout' });
    expect(req.request.body).toEqual({ labId: 'lab-1', packId: 'pack-5' });
    req.flush({ purchaseId: 'pur-1', url: 'http://127.0.0.1:4627/pay/cs_test_1' });
    expect(assign).toHaveBeenCalledWith('http://127.0.0.1:4627/pay/cs_test_1');
  });

  it('on return waits for the provider’s confirmation, then shows the outcome and the new balance', async () => {
    {
      const { fixture, el } = await render({ checkout: 'success', purchase: 'pur-1' });
      expect(el.textContent).toContain('Confirming your payment');
      http.expectOne('/api/billing/purchases/pur-1').flush(purchase('pending', 'Waiting for the payment to be confirmed.'));
      // The page looks again a second later (real time: Angular's scheduler needs real timers).
      await new Promise((r) => setTimeout(r, 1100));
      http.expectOne('/api/billing/purchases/pur-1').flush(purchase('completed', 'Paid: 5 report credits added to your balance with Kestrel Bay Radio Test Lab.'));
      http.expectOne('/api/billing/offers').flush({ items: [offer(7)] });
      http.expectOne((r) => r.url === '/api/billing/purchases').flush({ items: [purchase('completed', 'Paid.')], total: 1, page: 1, pageSize: 10 });
      await fixture.whenStable();
      expect(el.querySelector('.outcome[role="status"]')!.textContent).toContain('Paid: 5 report credits added');
      expect(el.textContent).toContain('7 credits');
      expect(el.textContent).toContain('RC-0001');
    }
  });

  it('says nothing was charged when the buyer left the payment page', async () => {
    const { el } = await render({ checkout: 'cancelled', purchase: 'pur-1' });
    expect(el.querySelector('.outcome[role="alert"]')!.textContent).toContain('Nothing was charged');
    http.expectNone('/api/billing/purchases/pur-1');
  });
});
