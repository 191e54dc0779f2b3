import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RunInstruments } from './run-instruments';
import type { RunInstrument } from './runs-api';

jest.setTimeout(20_000);

const instrument = (id: string, status: RunInstrument['calibrationStatus'], due: string): RunInstrument => ({ id, name: `Analyzer ${id}`, model: 'SA-1', serialNumber: `SN-${id}`, calibratedOn: '2025-01-01', calibrationDue: due, calibrationStatus: status, certificateRef: `CERT-${id}` });

describe('RunInstruments', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lets an overdue instrument be chosen and shows the server’s refusal unchanged', async () => {
    const fixture = TestBed.createComponent(RunInstruments);
    fixture.componentRef.setInput('runId', 'run-1');
    fixture.componentRef.setInput('assigned', [instrument('a', 'valid', '2027-06-01')]);
    fixture.componentRef.setInput('editable', true);
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.textContent).toContain('In calibration (due 2027-06-01)');
    [...el.querySelectorAll('button')].find((b) => b.textContent!.includes('Choose instruments'))!.click();
    http.expectOne((r) => r.url === '/api/instruments').flush({ items: [instrument('a', 'valid', '2027-06-01'), instrument('b', 'overdue', '2026-01-31')], total: 2, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(el.textContent).toContain('Calibration overdue (due 2026-01-31)');
    const boxes = el.querySelectorAll('input[type="checkbox"]');
    (boxes[1] as HTMLInputElement).click();
    await fixture.whenStable();
    [...el.querySelectorAll('button')].find((b) => b.textContent!.includes('Save instruments'))!.click();
    const put = http.expectOne({ method: 'PUT', url: '/api/runs/run-1/instruments' });
    expect(put.request.body).toEqual({ instrumentIds: ['a', 'b'] });
    const message = 'Analyzer b s/n SN-b was due for calibration on 2026-01-31. Calibrate it, or use another instrument, before using it on a run.';
    put.flush({ detail: message, code: 'calibration-overdue' }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    expect(el.querySelector('[role="alert"]')!.textContent!.trim()).toBe(message);
  });
});
