import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { MatDialog } from '@angular/material/dialog';
import { of } from 'rxjs';
import { ReviewPage } from './review-page';
import { SessionStore } from '../session/session-store';
import type { RunDetail } from '../runs/runs-api';

jest.mock('uplot', () => ({ __esModule: true, default: jest.fn() }));

const run = (state: RunDetail['state']): RunDetail => ({
  id: 'run-1',
  number: 'RUN-000042',
  state,
  engineerId: 'eng',
  reviewerId: null,
  returnReason: null,
  instruments: [],
  plan: { id: 'p', name: 'Plan', ruleSet: { name: 'US maritime', version: 1 } as RunDetail['plan']['ruleSet'] },
  device: { id: 'd', manufacturer: 'Halyard', model: 'HX-90', serialNumber: 'SN1', emissionDesignator: '2K70J3E', ratedPepW: 125 },
  client: { id: 'c', name: 'Halyard Marine', contactName: 'D', contactEmail: 'd@x.example' },
  testCases: [
    {
      id: 'case-1',
      position: 1,
      kind: 'carrier-suppression',
      label: 'Carrier',
      parameters: { frequencyHz: 2_182_000, sideband: 'USB' },
      reading: { id: 'r', values: { pepDbm: 51, carrierDbm: 8.2 }, createdAt: '2026-11-02T09:00:00Z' },
      result: {
        id: 'res', readingId: 'r', engineVersion: '1.0.0', value: 42.8, unit: 'dB below PEP', limit: 40, margin: 2.8, expandedUncertainty: 0.62, coverageFactor: 2, verdict: 'pass',
        detail: { limitText: 'at least 40 dB below PEP (47 CFR 80.207(c))', decisionRuleText: 'Simple acceptance', combinedStandard: 0.31, budget: [{ name: 'Analyzer scale fidelity (example)', standard: 0.289, contribution: 0.289, varianceShare: 0.87 }] },
        createdAt: '2026-11-02T09:00:00Z',
      },
      uploads: [],
      traceResult: null,
    },
  ],
});

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('ReviewPage', () => {
  let http: HttpTestingController;
  const reasons: (string | undefined)[] = [];

  beforeEach(() => {
    reasons.length = 0;
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: MatDialog, useValue: { open: () => ({ afterClosed: () => of(reasons.shift()) }) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...roles) => roles.includes('reviewer'));
  });

  async function render(state: RunDetail['state']) {
    const fixture = TestBed.createComponent(ReviewPage);
    fixture.componentRef.setInput('id', 'run-1');
    fixture.detectChanges();
    http.expectOne('/api/runs/run-1').flush(run(state));
    await fixture.whenStable();
    http.match('/api/runs/run-1/cases/case-1/comments').forEach((r) => r.flush({ items: [] }));
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  const button = (el: HTMLElement, text: string) => [...el.querySelectorAll('button')].find((b) => b.textContent!.includes(text))!;

  it('shows each result with its limit, budget rows and the reading as entered', async () => {
    const { el } = await render('in-review');
    expect(el.textContent).toContain('at least 40 dB below PEP (47 CFR 80.207(c))');
    expect(el.textContent).toContain('Analyzer scale fidelity (example)');
    expect(el.textContent).toContain('Carrier level (dBm)');
    expect(el.textContent).toContain('8.2');
  });

  it('shows the server’s four-eyes refusal as the rule it is, prominently', async () => {
    const { fixture, el } = await render('in-review');
    button(el, 'Authorize results').click();
    http.expectOne({ method: 'POST', url: '/api/runs/run-1/approve' }).flush({ detail: 'You took readings on this run, so a different reviewer must authorize it.' }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    const alert = el.querySelector('.four-eyes[role="alert"]')!;
    expect(alert.textContent).toContain('Four-eyes rule');
    expect(alert.textContent).toContain('a different reviewer must authorize it');
  });

  it('returns the run to the bench with the reason given in the dialog', async () => {
    const { fixture, el } = await render('in-review');
    reasons.push('Repeat the carrier reading with a 10 Hz RBW.');
    button(el, 'Return to the bench').click();
    const req = http.expectOne({ method: 'POST', url: '/api/runs/run-1/return' });
    expect(req.request.body).toEqual({ reason: 'Repeat the carrier reading with a 10 Hz RBW.' });
    req.flush({});
    http.expectOne('/api/runs/run-1').flush(run('testing'));
    await fixture.whenStable();
    expect(el.querySelector('[role="status"]')!.textContent).toContain('Returned to the bench');
  });

  it('sends nothing when the dialog is cancelled, and offers no decision on a run not in review', async () => {
    const { el } = await render('in-review');
    reasons.push(undefined);
    button(el, 'Return to the bench').click();
    http.expectNone('/api/runs/run-1/return');
    const done = await render('testing');
    expect(button(done.el, 'Authorize results')).toBeUndefined();
    expect(done.el.textContent).toContain('not awaiting review');
  });
});
