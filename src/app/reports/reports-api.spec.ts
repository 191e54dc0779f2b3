import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { ReportsApi, type ReportDetail } from './reports-api';

// The server's contract: server/reports/routes.ts.
describe('ReportsApi', () => {
  let api: ReportsApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ReportsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // An invented report (test fixture).
  const detail: ReportDetail = {
    id: 'rep-1', runId: 'run-9', reportNumber: 'KBRTL-2026-0007', revision: 1, sha256: 'a'.repeat(64), pageCount: 6, summary: { device: 'Halyard HX-90' },
    issuedAt: '2026-11-02T10:00:00Z', status: 'withdrawn', verifyPath: '/verify/t1', reason: 'Wrong device', supersededById: null,
  };

  it('lists with page, size and sort, and a search only when there is one', async () => {
    const page = firstValueFrom(api.list({ page: 1, pageSize: 25, sort: '-issuedAt', search: 'KBRTL' }));
    const req = http.expectOne((r) => r.url === '/api/reports');
    expect(req.request.method).toBe('GET');
    expect(req.request.params.toString()).toBe('page=1&pageSize=25&sort=-issuedAt&search=KBRTL');
    req.flush({ items: [detail], total: 1, page: 1, pageSize: 25 });
    expect((await page).total).toBe(1);
    api.list({ page: 1, pageSize: 25, sort: '-issuedAt', search: '' }).subscribe();
    expect(http.expectOne((r) => r.url === '/api/reports').request.params.toString()).toBe('page=1&pageSize=25&sort=-issuedAt');
  });

  it('reads one report with why its status changed, and its PDF as bytes', async () => {
    const one = firstValueFrom(api.get('rep/1'));
    http.expectOne({ method: 'GET', url: '/api/reports/rep%2F1' }).flush(detail);
    expect((await one).reason).toBe('Wrong device');
    const pdf = firstValueFrom(api.pdf('rep-1'));
    const req = http.expectOne({ method: 'GET', url: '/api/reports/rep-1/pdf' });
    expect(req.request.responseType).toBe('blob');
    const blob = new Blob(['%PDF-1.7']);
    req.flush(blob);
    expect(await pdf).toBe(blob);
  });

  it('withdraws a report with its reason, and reopens its run for correction with one', async () => {
    const withdrawn = firstValueFrom(api.withdraw('rep-1', 'The device tested was not the one registered.'));
    const w = http.expectOne('/api/reports/rep-1/withdraw');
    expect(w.request.method).toBe('POST');
    expect(w.request.body).toEqual({ reason: 'The device tested was not the one registered.' });
    w.flush(detail);
    expect((await withdrawn).status).toBe('withdrawn');
    const revised = firstValueFrom(api.revise('run-9', 'Carrier suppression read with the wrong RBW.'));
    const r = http.expectOne('/api/runs/run-9/revise');
    expect(r.request.method).toBe('POST');
    expect(r.request.body).toEqual({ reason: 'Carrier suppression read with the wrong RBW.' });
    r.flush({ id: 'run-9', state: 'testing' });
    expect(await revised).toEqual({ id: 'run-9', state: 'testing' });
  });
});
