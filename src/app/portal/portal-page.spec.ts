import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { PortalPage } from './portal-page';
import type { ReportRow } from '../reports/reports-api';
import { alerts, buttonNamed, problem, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented labs, radios and reports (test fixtures).
const report = (id: string, lab: string, device: string, verdicts: string[], status: ReportRow['status'] = 'current', revision = 1): ReportRow => ({
  id, runId: `run-${id}`, reportNumber: `KBRTL-2026-${id}`, revision, sha256: 'a'.repeat(64), pageCount: 6,
  summary: { lab, device, serialNumber: 'SN-7', client: 'Halyard Marine', verdicts }, issuedAt: '2026-11-02T10:00:00Z', status, verifyPath: `/verify/t-${id}`,
});

describe('PortalPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const reportsRequest = () => http.expectOne((r) => r.method === 'GET' && r.url === '/api/reports');

  async function render(rows: ReportRow[], total = rows.length, balance = { items: [{ lab: { id: 'lab-1', name: 'Kestrel Bay' }, clientId: 'cl-1', clientName: 'Halyard Marine', invoiceLater: false, balance: 1, lastActivityAt: null }], totalCredits: 1 }) {
    const fixture = TestBed.createComponent(PortalPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading your reports"]')).not.toBeNull();
    expect(el.textContent).toContain('Loading your balance…');
    const req = reportsRequest();
    // The 200 newest: the API's largest page.
    expect(req.request.params.get('page')).toBe('1');
    expect(req.request.params.get('pageSize')).toBe('200');
    expect(req.request.params.get('sort')).toBe('-issuedAt');
    req.flush({ items: rows, total, page: 1, pageSize: 200 });
    http.expectOne({ method: 'GET', url: '/api/billing/balance' }).flush(balance);
    await fixture.whenStable();
    return { fixture, el };
  }

  it('groups the reports by lab and device, with the worst verdict and the status in words', async () => {
    const { el } = await render([
      report('0007', 'Kestrel Bay', 'Halyard HX-90', ['pass', 'conditional-pass']),
      report('0006', 'Kestrel Bay', 'Halyard HX-90', ['pass'], 'superseded'),
      report('0101', 'Anchor Point Labs', 'Halyard HX-20', ['pass', 'fail']),
    ]);
    const labs = [...el.querySelectorAll('section.lab')];
    expect(labs.map((s) => textOf(s.querySelector('h2')))).toEqual(['Anchor Point Labs', 'Kestrel Bay']);
    expect(textOf(labs[1].querySelector('p'))).toBe('1 device · 1 current report');
    const rows = [...labs[1].querySelectorAll('tbody tr')].map(textOf);
    expect(rows).toHaveLength(2);
    // ILAC-G8:09/2019 verdicts; the page shows the least favourable one of a report.
    expect(rows[0]).toContain('Conditional pass');
    expect(rows[0]).toContain('Current');
    expect(rows[1]).toContain('Superseded');
    expect(textOf(labs[0].querySelector('tbody tr'))).toContain('Fail');
    expect(el.querySelector('a[aria-label="Verify KBRTL-2026-0007 revision 1"]')!.getAttribute('href')).toBe('/verify/t-0007');
    expect(textOf(el.querySelector('section[aria-labelledby="credits-title"] li'))).toBe('Kestrel Bay1 credit');
  });

  it('says no lab has issued a report yet', async () => {
    const { el } = await render([], 0, { items: [], totalCredits: 0 });
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No laboratory has issued a report to you yet. Reports appear here as soon as they are signed.');
    expect(el.textContent).toContain('You are not a client of any laboratory yet.');
  });

  it('says when only the newest 200 are shown and links to the search', async () => {
    const { el } = await render([report('0007', 'Kestrel Bay', 'Halyard HX-90', ['pass'])], 250);
    expect(textOf(el.querySelector('p.sc-muted:not(section p)'))).toBe('Showing your 200 newest reports of 250. Search all reports');
    expect(el.querySelector('a[href="/reports"]')).not.toBeNull();
  });

  it('downloads the signed PDF under the report’s number and revision', async () => {
    const { fixture, el } = await render([report('0007', 'Kestrel Bay', 'Halyard HX-90', ['pass'], 'current', 2)]);
    const saved: string[] = [];
    Object.assign(URL, { createObjectURL: jest.fn(() => 'blob:report'), revokeObjectURL: jest.fn() });
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      saved.push(this.download);
    });
    const button = el.querySelector<HTMLButtonElement>('button[aria-label="PDF of KBRTL-2026-0007 revision 2"]')!;
    button.click();
    await fixture.whenStable();
    expect(button.disabled).toBe(true);
    const req = http.expectOne({ method: 'GET', url: '/api/reports/0007/pdf' });
    expect(req.request.responseType).toBe('blob');
    req.flush(new Blob(['%PDF-1.7'], { type: 'application/pdf' }));
    await fixture.whenStable();
    expect(saved).toEqual(['KBRTL-2026-0007-rev2.pdf']);
    expect(button.disabled).toBe(false);
    click.mockRestore();
  });

  it('shows the server’s problem and tries again; the balance shows its own', async () => {
    const fixture = TestBed.createComponent(PortalPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    reportsRequest().flush(...problem(403, 'Only members of a manufacturer see this portal.'));
    http.expectOne('/api/billing/balance').flush(...problem(503, 'Billing is unavailable for a moment.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Billing is unavailable for a moment.', 'Only members of a manufacturer see this portal. Try again']);
    expect(el.querySelector('.sc-empty')).toBeNull();
    buttonNamed(el, 'Try again').click();
    reportsRequest().flush({ items: [], total: 0, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Billing is unavailable for a moment.']);
  });
});
