import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { AuditorApi, type GrantedReport } from './auditor-api';

// The server's contract: server/auditors/routes.ts (the grant's conditions decide what is listed).
describe('AuditorApi', () => {
  let api: AuditorApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(AuditorApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // An invented report (test fixture).
  const row: GrantedReport = {
    id: 'rep-1', reportNumber: 'KBRTL-2026-0007', revision: 1, issuedAt: '2026-11-02T10:00:00Z', sha256: 'a'.repeat(64), pageCount: 6,
    lab: 'Kestrel Bay', client: 'Halyard Marine', device: 'Halyard HX-90', serialNumber: 'SN-7', status: 'current', verifyPath: '/verify/t1',
  };

  it('lists the granted reports with page, size, sort and search, leaving out an empty search', async () => {
    const page = firstValueFrom(api.list({ page: 2, pageSize: 25, sort: '-issuedAt', search: 'HX-90' }));
    const req = http.expectOne((r) => r.url === '/api/auditor/reports');
    expect(req.request.method).toBe('GET');
    expect(req.request.params.toString()).toBe('page=2&pageSize=25&sort=-issuedAt&search=HX-90');
    req.flush({ items: [row], total: 26, page: 2, pageSize: 25 });
    expect(await page).toEqual({ items: [row], total: 26, page: 2, pageSize: 25 });
    api.list({ page: 1, pageSize: 25, sort: 'reportNumber', search: '' }).subscribe();
    expect(http.expectOne((r) => r.url === '/api/auditor/reports').request.params.has('search')).toBe(false);
  });

  it('fetches a report’s PDF as bytes, its id escaped in the path', async () => {
    const pdf = firstValueFrom(api.pdf('rep/1'));
    const req = http.expectOne('/api/auditor/reports/rep%2F1/pdf');
    expect(req.request.method).toBe('GET');
    expect(req.request.responseType).toBe('blob');
    const blob = new Blob(['%PDF-1.7'], { type: 'application/pdf' });
    req.flush(blob);
    expect(await pdf).toBe(blob);
  });
});
