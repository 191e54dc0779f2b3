import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { VerifyApi, type VerifiedReport } from './verify-api';

// The server's contract: the public GET /api/verify/:token (no sign-in).
describe('VerifyApi', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('looks a token up, escaped in the path, and hands back the report as verified', async () => {
    // An invented report (test fixture).
    const report: VerifiedReport = {
      reportNumber: 'KBRTL-2026-0007', revision: 2, lab: 'Kestrel Bay', client: 'Halyard Marine', device: 'Halyard HX-90', serialNumber: 'SN-7', receivedOn: '2026-10-28',
      testedFrom: '2026-10-30', testedTo: '2026-10-31', issuedAt: '2026-11-02T10:00:00Z', sha256: 'a'.repeat(64), status: 'current', reason: null, supersededBy: null,
    };
    const found = firstValueFrom(TestBed.inject(VerifyApi).lookup('t/k n'));
    const req = http.expectOne('/api/verify/t%2Fk%20n');
    expect(req.request.method).toBe('GET');
    expect(req.request.body).toBeNull();
    req.flush(report);
    expect(await found).toEqual(report);
  });
});
