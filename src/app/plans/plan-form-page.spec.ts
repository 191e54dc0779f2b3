import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ActivatedRoute, Router, convertToParamMap, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { PlanFormPage } from './plan-form-page';
import type { RuleSetRow } from './plans-api';
import type { DeviceRow } from '../devices/devices-api';
import { SAMPLE_RULE_SETS } from '../../../shared/rules/sample-rule-sets';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, settle, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented radios (test fixtures); rule sets: the shipped samples (shared/rules/sample-rule-sets.ts) and an invented lab copy.
const device = (n: number): DeviceRow => ({
  id: `dev-${n}`, clientId: 'cl-1', manufacturer: 'Halyard', model: `HX-${n}0`, serialNumber: `SN-${n}`, ratedPepW: 150, emissionDesignator: '2K70J3E',
  frequencyMinHz: 1_600_000, frequencyMaxHz: 27_500_000, modes: ['USB'], receivedOn: '2026-11-01', createdAt: '2026-11-01T00:00:00Z',
});
const aviation = SAMPLE_RULE_SETS.find((s) => s.body.service !== 'maritime')!;
const maritime = SAMPLE_RULE_SETS[0];
const ruleSets: RuleSetRow[] = [
  { id: 'rs-aviation', name: aviation.name, version: 1, isSample: true, builtIn: true, body: aviation.body },
  { id: 'rs-maritime', name: maritime.name, version: 1, isSample: true, builtIn: true, body: maritime.body },
  { id: 'rs-own', name: 'Kestrel maritime', version: 4, isSample: false, builtIn: false, body: { ...maritime.body, sampleNotice: undefined } },
];

describe('PlanFormPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;
  let deviceId: string | null;

  beforeEach(() => {
    deviceId = null;
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    const route = TestBed.inject(ActivatedRoute);
    Object.defineProperty(route, 'snapshot', { get: () => ({ queryParamMap: convertToParamMap(deviceId ? { deviceId } : {}) }) });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(PlanFormPage);
    await fixture.whenStable();
    const devices = http.expectOne((r) => r.method === 'GET' && r.url === '/api/devices');
    expect(devices.request.params.get('pageSize')).toBe('200');
    devices.flush({ items: [device(1), device(2)], total: 2, page: 1, pageSize: 200 });
    const sets = http.expectOne((r) => r.method === 'GET' && r.url === '/api/rule-sets');
    expect(sets.request.params.get('latest')).toBe('true');
    sets.flush({ items: ruleSets });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const select = async (label: string) => (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatSelectHarness))!;
    return { fixture, el: fixture.nativeElement as HTMLElement, loader, select };
  }

  it('takes the device from the address, picks a maritime rule set, and shows a sample’s notice', async () => {
    deviceId = 'dev-2';
    const { el, select } = await render();
    expect(await (await select('Device under test')).getValueText()).toBe('HX-20 · s/n SN-2');
    expect(await (await select('Rule set')).getValueText()).toBe(`${maritime.name} (v1) · sample`);
    expect(textOf(el.querySelector('[role="note"]'))).toContain(maritime.body.sampleNotice!);
  });

  it('lists every rule set with its version, and drops the notice for the lab’s own', async () => {
    const { fixture, el, select } = await render();
    const rules = await select('Rule set');
    await rules.open();
    const options = await rules.getOptions();
    expect(await Promise.all(options.map((o) => o.getText()))).toEqual([`${aviation.name} (v1) · sample`, `${maritime.name} (v1) · sample`, 'Kestrel maritime (v4)']);
    await rules.clickOptions({ text: 'Kestrel maritime (v4)' });
    await fixture.whenStable();
    expect(el.querySelector('[role="note"]')).toBeNull();
  });

  it('saves the plan in the API’s units, starts a run from it and opens the run', async () => {
    deviceId = 'dev-1';
    const { fixture, el, loader, select } = await render();
    await (await inputLabelled(loader, 'Plan name')).setValue('  Type test, HX-10 ');
    buttonNamed(el, 'Add a test point').click();
    await fixture.whenStable();
    const labels = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Label' }));
    expect(labels).toHaveLength(2);
    const kinds = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Measurement' }));
    const secondKind = (await kinds[1].getControl(MatSelectHarness))!;
    await secondKind.open();
    await secondKind.clickOptions({ text: 'Emission mask' });
    await (await labels[1].getControl(MatInputHarness))!.setValue(' 8291 kHz, LSB ');
    const sidebands = await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Sideband' }));
    const secondSideband = (await sidebands[1].getControl(MatSelectHarness))!;
    await secondSideband.open();
    await secondSideband.clickOptions({ text: 'LSB' });
    expect(await (await select('Device under test')).getValueText()).toBe('HX-10 · s/n SN-1');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Saving"]')).not.toBeNull();
    const plan = http.expectOne({ method: 'POST', url: '/api/plans' });
    expect(plan.request.body).toEqual({
      deviceId: 'dev-1', ruleSetId: 'rs-maritime', name: 'Type test, HX-10',
      // MHz on screen, Hz in the API: 2.182 MHz is the maritime distress frequency 2182 kHz (ITU Radio Regulations), 8.291 MHz the page's second default.
      testPoints: [
        { kind: 'carrier-suppression', label: '2182 kHz, full power', frequencyHz: 2_182_000, sideband: 'USB' },
        { kind: 'emission-mask', label: '8291 kHz, LSB', frequencyHz: 8_291_000, sideband: 'LSB' },
      ],
    });
    plan.flush({ id: 'plan-1', name: 'Type test, HX-10', deviceId: 'dev-1', testCases: [] });
    const run = http.expectOne({ method: 'POST', url: '/api/runs' });
    expect(run.request.body).toEqual({ planId: 'plan-1' });
    run.flush({ id: 'run-5' });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/runs', 'run-5']);
  });

  it('shows what is missing beside each field and sends nothing', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'Plan name')).setValue('');
    await (await inputLabelled(loader, 'Label')).setValue('');
    await (await inputLabelled(loader, 'Frequency')).setValue('0');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Device under test')).toEqual(['Choose the device.']);
    expect(await errorsOf(loader, 'Plan name')).toEqual(['Give the plan a name.']);
    expect(await errorsOf(loader, 'Label')).toEqual(['Give the test point a label.']);
    expect(await errorsOf(loader, 'Frequency')).toEqual(['Enter a frequency above 0 MHz.']);
    http.expectNone('/api/plans');
  });

  it('keeps at least one test point', async () => {
    const { fixture, el } = await render();
    const remove = el.querySelector<HTMLButtonElement>('button[aria-label="Remove test point 1"]')!;
    expect(remove.disabled).toBe(true);
    buttonNamed(el, 'Add a test point').click();
    await fixture.whenStable();
    expect(remove.disabled).toBe(false);
    el.querySelector<HTMLButtonElement>('button[aria-label="Remove test point 2"]')!.click();
    await fixture.whenStable();
    expect(el.querySelectorAll('.point')).toHaveLength(1);
  });

  it('shows the server’s refusal and lets the person try again', async () => {
    deviceId = 'dev-1';
    const { fixture, el } = await render();
    submit(el);
    http.expectOne('/api/plans').flush(...problem(422, 'The device covers 1.6 to 27.5 MHz: 2182 kHz is inside, check the other test points.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['The device covers 1.6 to 27.5 MHz: 2182 kHz is inside, check the other test points.']);
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
    http.expectNone('/api/runs');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('shows that it is loading the devices and rule sets, and offers no saving until both are read', async () => {
    deviceId = 'dev-1';
    const fixture = TestBed.createComponent(PlanFormPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the devices and rule sets"]')).not.toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    submit(el);
    http.expectNone('/api/plans');
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [device(1)], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    // One list alone is not enough to build a plan.
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the devices and rule sets"]')).not.toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    http.expectOne((r) => r.url === '/api/rule-sets').flush({ items: ruleSets });
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
  });

  it('shows why the devices could not be listed, and lists them again on request', async () => {
    deviceId = 'dev-2';
    const fixture = TestBed.createComponent(PlanFormPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    http.expectOne((r) => r.url === '/api/devices').flush(...problem(403, 'Only lab members may plan tests.'));
    // The rule sets' request is given up with the failed one; both are asked again on retry.
    expect(http.expectOne((r) => r.url === '/api/rule-sets').cancelled).toBe(true);
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Only lab members may plan tests. Try again']);
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    buttonNamed(el, 'Try again').click();
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the devices and rule sets"]')).not.toBeNull();
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [device(1), device(2)], total: 2, page: 1, pageSize: 200 });
    http.expectOne((r) => r.url === '/api/rule-sets').flush({ items: ruleSets });
    await fixture.whenStable();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const devices = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Device under test' }))).getControl(MatSelectHarness))!;
    expect(await devices.getValueText()).toBe('HX-20 · s/n SN-2');
  });

  it('shows why the rule sets could not be listed', async () => {
    const fixture = TestBed.createComponent(PlanFormPage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [device(1)], total: 1, page: 1, pageSize: 200 });
    http.expectOne((r) => r.url === '/api/rule-sets').flush(null, { status: 0, statusText: 'Unknown Error' });
    await fixture.whenStable();
    // The product's own wording for a network failure (session/problem-message.ts).
    expect(alerts(fixture.nativeElement)).toEqual(['Sidecheck cannot be reached. Check your connection and try again. Try again']);
  });

  it('puts the server’s field errors under the test point they name', async () => {
    deviceId = 'dev-1';
    const { fixture, el, loader } = await render();
    submit(el);
    // Pointers into the request body (frequencyHz in the API, MHz on screen), as server/http/problem.ts writes them.
    http.expectOne('/api/plans').flush(...problem(422, 'The plan has 2 problems: /testPoints/0/frequencyHz must be >= 1000.', [
      { pointer: '/testPoints/0/frequencyHz', message: 'must be >= 1000' },
      { pointer: '/deviceId', message: 'is not one of your devices' },
    ]));
    await fixture.whenStable();
    expect(await errorsOf(loader, 'Frequency')).toEqual(['Must be >= 1000']);
    expect(await errorsOf(loader, 'Device under test')).toEqual(['Is not one of your devices']);
    // The product's own wording.
    expect(alerts(el)).toEqual(['Correct the 2 fields marked below and try again.']);
    http.expectNone('/api/runs');
  });
});
