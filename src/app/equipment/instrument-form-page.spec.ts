import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { InstrumentFormPage } from './instrument-form-page';
import { todayUtc } from './calibration-dates';
import type { Instrument } from './equipment-api';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, settle, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// An invented instrument (test fixture).
const stored: Instrument = {
  id: 'in-1', name: 'Spectrum analyzer, bench 2', model: 'SA-3', serialNumber: 'SA3-0042', calibratedOn: '2025-11-20', calibrationDue: '2026-11-20',
  certificateRef: 'Harbour Cal 2025-118', calibrationStatus: 'due-soon', createdAt: '2025-11-21T00:00:00Z', updatedAt: '2025-11-21T00:00:00Z',
  contributions: [
    { name: 'Level accuracy', budget: 'absolute', distribution: 'normal', value: 0.6, coverageFactor: 2 },
    { name: 'Mismatch', budget: 'relative', distribution: 'u-shaped', value: 0.2 },
  ],
};

describe('InstrumentFormPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  async function render(id?: string) {
    const fixture = TestBed.createComponent(InstrumentFormPage);
    if (id) fixture.componentRef.setInput('id', id);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  async function fillIdentity(loader: Awaited<ReturnType<typeof render>>['loader']) {
    await (await inputLabelled(loader, 'Instrument name')).setValue(' Power meter ');
    await (await inputLabelled(loader, 'Model')).setValue('PM-1');
    await (await inputLabelled(loader, 'Serial number')).setValue('PM1-7');
    await (await inputLabelled(loader, 'Calibrated on')).setValue('2026-01-10');
    await (await inputLabelled(loader, 'Calibration due')).setValue('2027-01-10');
    await (await inputLabelled(loader, 'Certificate')).setValue('Harbour Cal 2026-004');
  }

  it('adds an instrument with its contribution, showing the standard uncertainty as it is typed', async () => {
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Contribution')).setValue('Sensor linearity');
    await (await inputLabelled(loader, 'Half-width a')).setValue('0.5');
    await fixture.whenStable();
    // GUM JCGM 100:2008 §4.3.7: rectangular half-width a gives u = a/√3 = 0.5/1.732 = 0.289 dB.
    expect(textOf(el.querySelector('output[aria-label="Standard uncertainty of contribution 1"]'))).toBe('u = 0.289 dB');
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/instruments' });
    expect(req.request.body).toEqual({
      name: 'Power meter', model: 'PM-1', serialNumber: 'PM1-7', calibratedOn: '2026-01-10', calibrationDue: '2027-01-10', certificateRef: 'Harbour Cal 2026-004',
      contributions: [{ name: 'Sensor linearity', budget: 'relative', distribution: 'rectangular', value: 0.5 }],
    });
    req.flush({ ...stored, id: 'in-2' });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/equipment']);
  });

  it('asks for U and k for a normal distribution and sends k', async () => {
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Contribution')).setValue('Certificate');
    const [, distribution] = await loader.getAllHarnesses(MatSelectHarness);
    await distribution.open();
    await distribution.clickOptions({ text: 'Normal (certificate U with k)' });
    await (await inputLabelled(loader, 'Expanded U')).setValue('1');
    await (await inputLabelled(loader, 'k')).setValue('2');
    await fixture.whenStable();
    // GUM §4.3.6: a certificate's U with coverage factor k gives u = U/k = 1/2 = 0.500 dB.
    expect(textOf(el.querySelector('output[aria-label="Standard uncertainty of contribution 1"]'))).toBe('u = 0.500 dB');
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/instruments' });
    expect(req.request.body.contributions).toEqual([{ name: 'Certificate', budget: 'relative', distribution: 'normal', value: 1, coverageFactor: 2 }]);
    req.flush(stored);
    await settle(fixture);
  });

  it('shows what is missing beside each field and sends nothing', async () => {
    const { fixture, el, loader } = await render();
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Instrument name')).toEqual(['Enter a name.']);
    expect(await errorsOf(loader, 'Calibrated on')).toEqual(['Enter the calibration date.']);
    expect(await errorsOf(loader, 'Calibration due')).toEqual(['Enter the due date.']);
    expect(await errorsOf(loader, 'Certificate')).toEqual(['Enter the certificate reference.']);
    expect(await errorsOf(loader, 'Contribution')).toEqual(['Name it.']);
    http.expectNone('/api/instruments');
  });

  it('refuses a due date on or before the calibration date under the due date, as the server does', async () => {
    // server/instruments/instrument-checks.ts: calibrationDue must be after calibratedOn (the same day is refused).
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Calibration due')).setValue('2026-01-10');
    buttonNamed(el, 'Remove contribution 1').click();
    await fixture.whenStable();
    // The product's own wording.
    expect(el.textContent).toContain('No contributions: this instrument adds nothing to the budgets.');
    expect(await errorsOf(loader, 'Calibration due')).toEqual(['The calibration must fall due after the day it was done (2026-01-10).']);
    submit(el);
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    http.expectNone('/api/instruments');
    // Moving the calibration date back clears it: the due date is judged again.
    await (await inputLabelled(loader, 'Calibrated on')).setValue('2026-01-09');
    expect(await errorsOf(loader, 'Calibration due')).toEqual([]);
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/instruments' });
    expect(req.request.body).toMatchObject({ calibratedOn: '2026-01-09', calibrationDue: '2026-01-10' });
  });

  it('refuses a calibration dated after today (UTC, as the server judges it) under its field, and takes today itself', async () => {
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Contribution')).setValue('Sensor linearity');
    const today = todayUtc();
    // The next calendar day in UTC.
    const tomorrow = new Date(Date.parse(`${today}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
    await (await inputLabelled(loader, 'Calibrated on')).setValue(tomorrow);
    await (await inputLabelled(loader, 'Calibration due')).setValue('2999-01-01');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Calibrated on')).toEqual([`The calibration cannot be after today (${today}, UTC).`]);
    expect(await errorsOf(loader, 'Calibration due')).toEqual([]);
    http.expectNone('/api/instruments');
    await (await inputLabelled(loader, 'Calibrated on')).setValue(today);
    expect(await errorsOf(loader, 'Calibrated on')).toEqual([]);
    expect(el.querySelector('input[formcontrolname="calibratedOn"]')!.getAttribute('max')).toBe(today);
    submit(el);
    expect(http.expectOne({ method: 'POST', url: '/api/instruments' }).request.body.calibratedOn).toBe(today);
  });

  it('loads an instrument with its contributions and saves the change with PUT', async () => {
    const { fixture, el, loader } = await render('in-1');
    expect(el.querySelector('mat-progress-bar[aria-label="Working"]')).not.toBeNull();
    http.expectOne({ method: 'GET', url: '/api/instruments/in-1' }).flush(stored);
    await fixture.whenStable();
    expect(textOf(el.querySelector('h1'))).toBe('Change instrument');
    expect(textOf(el.querySelector('sc-calibration-chip'))).toBe('Due within 30 days');
    expect(el.querySelectorAll('[role="group"][aria-label^="Contribution"]')).toHaveLength(2);
    // GUM §4.3.6 and F.2.4.4: U/k = 0.6/2 = 0.300 dB; U-shaped a/√2 = 0.2/1.414 = 0.141 dB.
    expect(textOf(el.querySelector('output[aria-label="Standard uncertainty of contribution 1"]'))).toBe('u = 0.300 dB');
    expect(textOf(el.querySelector('output[aria-label="Standard uncertainty of contribution 2"]'))).toBe('u = 0.141 dB');
    buttonNamed(el, 'Add a contribution').click();
    await fixture.whenStable();
    expect(el.querySelectorAll('[role="group"][aria-label^="Contribution"]')).toHaveLength(3);
    buttonNamed(el, 'Remove contribution 3').click();
    await (await inputLabelled(loader, 'Calibration due')).setValue('2027-11-20');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/instruments/in-1' });
    expect(req.request.body.calibrationDue).toBe('2027-11-20');
    expect(req.request.body.contributions).toEqual(stored.contributions);
    req.flush(stored);
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/equipment']);
  });

  it('shows the server’s refusal and stays on the form', async () => {
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Contribution')).setValue('Sensor linearity');
    submit(el);
    // The server judges "today" by its own clock (server/instruments/instrument-checks.ts), which need not agree with the browser's.
    http.expectOne('/api/instruments').flush(...problem(422, 'The instrument has 1 problem: /calibratedOn must not be after today (2026-01-09).', [{ pointer: '/calibratedOn', message: 'must not be after today (2026-01-09)' }]));
    await fixture.whenStable();
    // The server's words under the field the browser thought valid; the banner points at it (the product's own wording).
    expect(await errorsOf(loader, 'Calibrated on')).toEqual(['Must not be after today (2026-01-09)']);
    expect(alerts(el)).toEqual(['Correct the field marked below and try again.']);
    expect(navigate).not.toHaveBeenCalled();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
    // A changed date is judged afresh: the server's message goes and the form can be sent again.
    await (await inputLabelled(loader, 'Calibrated on')).setValue('2026-01-08');
    expect(await errorsOf(loader, 'Calibrated on')).toEqual([]);
    submit(el);
    expect(http.expectOne('/api/instruments').request.body.calibratedOn).toBe('2026-01-08');
  });

  it('keeps the server’s sentence in the banner when an error names no field of the form', async () => {
    const { fixture, el, loader } = await render();
    await fillIdentity(loader);
    await (await inputLabelled(loader, 'Contribution')).setValue('Sensor linearity');
    submit(el);
    http.expectOne('/api/instruments').flush(...problem(422, 'The instrument has 1 problem: /owner must NOT have additional properties.', [{ pointer: '/owner', message: 'must NOT have additional properties' }]));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['The instrument has 1 problem: /owner must NOT have additional properties.']);
  });
});
