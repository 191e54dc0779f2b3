import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { MatDialog } from '@angular/material/dialog';
import { of } from 'rxjs';
import { ReportsPage } from './reports-page';
import { SessionStore } from '../session/session-store';
import type { ReportRow } from './reports-api';

const row = (revision: number, status: ReportRow['status']): ReportRow => ({
  id: `rep-${revision}`, runId: 'run-9', reportNumber: 'KBRTL-2026-0007', revision, sha256: 'x', pageCount: 6,
  summary: { device: 'Halyard HX-90', client: 'Halyard Marine', lab: 'Kestrel Bay', verdicts: ['pass'] }, issuedAt: '2026-11-02T10:00:00Z', status, verifyPath: `/verify/t${revision}`,
});

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('ReportsPage actions', () => {
  let http: HttpTestingController;
  const reasons: (string | undefined)[] = [];
  let kind: 'lab' | 'manufacturer' = 'lab';

  beforeEach(() => {
    reasons.length = 0;
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MatDialog, useValue: { open: () => ({ afterClosed: () => of(reasons.shift()) }) } }],
    });
    http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(SessionStore);
    jest.spyOn(session, 'hasRole').mockImplementation((...roles) => roles.includes(kind === 'lab' ? 'reviewer' : 'manufacturer-admin'));
    jest.spyOn(session, 'membership').mockImplementation(() => ({ organizationId: 'org', kind, roles: [] }));
  });

  async function render(rows: ReportRow[]) {
    const fixture = TestBed.createComponent(ReportsPage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/reports').flush({ items: rows, total: rows.length, page: 1, pageSize: 25 });
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  /** Open the row's menu and pick an item (the menu renders in the CDK overlay, outside the page). */
  async function choose(fixture: { whenStable(): Promise<unknown> }, el: HTMLElement, item: string) {
    (el.querySelector('button[aria-label="Correct or withdraw KBRTL-2026-0007"]') as HTMLButtonElement).click();
    await fixture.whenStable();
    [...document.querySelectorAll<HTMLButtonElement>('[role="menuitem"]')].find((b) => b.textContent!.includes(item))!.click();
  }

  it('states each revision’s place in the chain', async () => {
    const { el } = await render([row(2, 'current'), row(1, 'superseded')]);
    expect(el.textContent).toContain('Current · replaces rev. 1');
    expect(el.textContent).toContain('Superseded by rev. 2');
  });

  it('withdraws a current report with the reason from the dialog, then reloads', async () => {
    const { fixture, el } = await render([row(1, 'current')]);
    reasons.push('The device under test was not the one registered.');
    await choose(fixture, el, 'Withdraw…');
    const req = http.expectOne({ method: 'POST', url: '/api/reports/rep-1/withdraw' });
    expect(req.request.body).toEqual({ reason: 'The device under test was not the one registered.' });
    req.flush({ ...row(1, 'withdrawn'), reason: 'x', supersededById: null });
    http.expectOne((r) => r.url === '/api/reports').flush({ items: [row(1, 'withdrawn')], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    expect(el.textContent).toContain('KBRTL-2026-0007 revision 1 is withdrawn.');
  });

  it('reopens the run for correction and takes the reviewer to it', async () => {
    const { fixture, el } = await render([row(1, 'current')]);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    reasons.push('Carrier suppression was read with the wrong RBW.');
    await choose(fixture, el, 'Correct (reopen for a new revision)…');
    const req = http.expectOne({ method: 'POST', url: '/api/runs/run-9/revise' });
    expect(req.request.body).toEqual({ reason: 'Carrier suppression was read with the wrong RBW.' });
    req.flush({ id: 'run-9', state: 'testing' });
    expect(navigate).toHaveBeenCalledWith(['/runs', 'run-9']);
  });

  it('offers neither action to a manufacturer, nor on a report that is not current', async () => {
    const lab = await render([row(1, 'superseded')]);
    expect(lab.el.querySelector('button[aria-label^="Correct or withdraw"]')).toBeNull();
    kind = 'manufacturer';
    const maker = await render([row(2, 'current')]);
    expect(maker.el.querySelector('button[aria-label^="Correct or withdraw"]')).toBeNull();
    expect(maker.el.querySelector('button[aria-label="PDF of KBRTL-2026-0007"]')).not.toBeNull();
    kind = 'lab';
  });
});
