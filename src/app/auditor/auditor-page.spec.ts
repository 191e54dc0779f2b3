import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { AuditorPage } from './auditor-page';

jest.setTimeout(20_000);

describe('AuditorPage', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  it('lists the granted reports with lab, status and a link to the verification page', async () => {
    const fixture = TestBed.createComponent(AuditorPage);
    await fixture.whenStable();
    const req = http.expectOne((r) => r.url === '/api/auditor/reports');
    expect(req.request.params.get('sort')).toBe('-issuedAt');
    req.flush({ items: [{ id: 'r1', reportNumber: 'KBRTL-2026-0001', revision: 1, issuedAt: '2026-11-02T10:00:00Z', sha256: 'x', pageCount: 6, lab: 'Kestrel Bay', client: 'Halyard', device: 'Halyard HX-90', serialNumber: 'SN1', status: 'withdrawn', verifyPath: '/verify/abc123def456' }], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.textContent).toContain('Kestrel Bay');
    expect(el.textContent).toContain('Withdrawn');
    expect(el.querySelector('a[aria-label="Verify KBRTL-2026-0001"]')!.getAttribute('href')).toBe('/verify/abc123def456');
  });

  it('explains an empty list', async () => {
    const fixture = TestBed.createComponent(AuditorPage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/auditor/reports').flush({ items: [], total: 0, page: 1, pageSize: 25 });
    await fixture.whenStable();
    expect(fixture.nativeElement.textContent).toContain('No laboratory has shared a report with you');
  });
});
