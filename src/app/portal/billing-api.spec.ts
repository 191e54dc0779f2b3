import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { BillingApi, type Purchase } from './billing-api';

// The server's contract: server/billing/routes.ts (the manufacturer's side).
describe('BillingApi (portal)', () => {
  let api: BillingApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(BillingApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // An invented purchase (test fixture).
  const purchase: Purchase = {
    id: 'pu-1', lab: { id: 'lab-1', name: 'Kestrel Bay' }, client: { id: 'cl-1', name: 'Halyard Marine' }, packId: 'pack-5', credits: 5, amountMinor: 4500,
    currency: 'EUR', amountText: '€45.00', status: 'completed', message: 'Paid: 5 credits were added.', receiptNumber: 'KBRTL-R2026-0001',
    receiptPath: '/api/billing/purchases/pu-1/receipt', createdAt: '2026-11-02T10:00:00Z', completedAt: '2026-11-02T10:01:00Z',
  };

  it('reads the balance at each lab and the offers', async () => {
    const balance = firstValueFrom(api.balance());
    const b = http.expectOne('/api/billing/balance');
    expect(b.request.method).toBe('GET');
    b.flush({ items: [], totalCredits: 0 });
    expect(await balance).toEqual({ items: [], totalCredits: 0 });
    const offers = firstValueFrom(api.offers());
    const o = http.expectOne('/api/billing/offers');
    expect(o.request.method).toBe('GET');
    o.flush({ items: [] });
    expect(await offers).toEqual({ items: [] });
  });

  it('opens a checkout for a lab and pack and hands back the payment page', async () => {
    const checkout = firstValueFrom(api.checkout('lab-1', 'pack-5'));
    const req = http.expectOne('/api/billing/checkout');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ labId: 'lab-1', packId: 'pack-5' });
    req.flush({ purchaseId: 'pu-1', url: 'http://127.0.0.1:4242/pay/cs_1' });
    expect(await checkout).toEqual({ purchaseId: 'pu-1', url: 'http://127.0.0.1:4242/pay/cs_1' });
  });

  it('lists purchases newest first, reads one by id, and fetches its receipt from the path it names', async () => {
    const list = firstValueFrom(api.purchases({ page: 3, pageSize: 10 }));
    const l = http.expectOne((r) => r.url === '/api/billing/purchases');
    expect(l.request.params.toString()).toBe('page=3&pageSize=10&sort=-createdAt');
    l.flush({ items: [purchase], total: 21, page: 3, pageSize: 10 });
    expect((await list).items).toEqual([purchase]);
    const one = firstValueFrom(api.purchase('pu/1'));
    http.expectOne({ method: 'GET', url: '/api/billing/purchases/pu%2F1' }).flush(purchase);
    expect((await one).message).toBe('Paid: 5 credits were added.');
    const receipt = firstValueFrom(api.receipt(purchase));
    const r = http.expectOne({ method: 'GET', url: '/api/billing/purchases/pu-1/receipt' });
    expect(r.request.responseType).toBe('blob');
    const blob = new Blob(['%PDF-1.7']);
    r.flush(blob);
    expect(await receipt).toBe(blob);
  });
});
