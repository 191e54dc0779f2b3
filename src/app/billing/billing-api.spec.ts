import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { LabBillingApi } from './billing-api';

// The server's contract: server/billing/routes.ts and shared/schemas/billing.ts.
describe('LabBillingApi', () => {
  let api: LabBillingApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(LabBillingApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('reads the sales overview with paging, sort and search, leaving out empty values', () => {
    api.sales({ page: 2, pageSize: 25, sort: '-balance', search: '' }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/billing/sales');
    expect(req.request.params.toString()).toBe('page=2&pageSize=25&sort=-balance');
  });

  it('replaces the price list with PUT and the body as given', () => {
    const body = { currency: 'GBP' as const, packs: [{ credits: 5, priceMinor: 80000 }], refundOnWithdrawWithinDays: 30 };
    api.savePriceList(body).subscribe();
    const req = http.expectOne('/api/billing/price-list');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual(body);
  });

  it('posts an adjustment with its reason', () => {
    api.adjust({ clientId: 'c1', credits: -2, reason: 'Duplicate purchase' }).subscribe();
    const req = http.expectOne('/api/billing/adjustments');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ clientId: 'c1', credits: -2, reason: 'Duplicate purchase' });
  });

  it('reads one client’s ledger, newest first', () => {
    api.ledger('c1', { page: 1, pageSize: 10 }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/billing/ledger');
    expect(req.request.params.get('clientId')).toBe('c1');
    expect(req.request.params.get('sort')).toBe('-createdAt');
    expect(req.request.params.get('pageSize')).toBe('10');
  });
});
