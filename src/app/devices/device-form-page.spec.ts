import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { DeviceFormPage } from './device-form-page';
import type { DeviceRow } from './devices-api';
import { alerts, errorsOf, inputLabelled, problem, settle, submit } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented clients and radios (test fixtures).
const clients = [
  { id: 'cl-1', name: 'Halyard Marine', contactName: 'Mara Quist', contactEmail: 'mara@halyard.example' },
  { id: 'cl-2', name: 'Tidewater Radio', contactName: 'Oskar Lind', contactEmail: 'oskar@tidewater.example' },
];
const stored: DeviceRow = {
  id: 'dev-9', clientId: 'cl-2', manufacturer: 'Tidewater Radio', model: 'TW-400', serialNumber: 'TW4-0012', firmware: '2.1',
  ratedPepW: 400, emissionDesignator: '2K70J3E', frequencyMinHz: 1_600_000, frequencyMaxHz: 30_000_000, modes: ['USB', 'LSB'],
  receivedOn: '2026-10-30', condition: 'Scratched front panel', createdAt: '2026-10-30T09:00:00Z',
};

describe('DeviceFormPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  async function render(id?: string, clientList = clients) {
    const fixture = TestBed.createComponent(DeviceFormPage);
    if (id) fixture.componentRef.setInput('id', id);
    await fixture.whenStable();
    const req = http.expectOne({ method: 'GET', url: '/api/clients?pageSize=200' });
    req.flush({ items: clientList, total: clientList.length, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const input = (label: string) => inputLabelled(loader, label);
    return { fixture, el: fixture.nativeElement as HTMLElement, loader, input };
  }

  const fieldErrors = errorsOf;

  it('registers a device: posts the body in the API’s units, then goes on to build its plan', async () => {
    const { fixture, el, loader, input } = await render();
    expect((await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Client' })))).toBeTruthy();
    const client = await loader.getHarness(MatSelectHarness);
    await client.open();
    await client.clickOptions({ text: 'Tidewater Radio' });
    await (await input('Manufacturer')).setValue(' Tidewater Radio ');
    await (await input('Model')).setValue('TW-400');
    await (await input('Serial number')).setValue('TW4-0012');
    await (await input('Rated PEP')).setValue('400');
    await (await input('Emission designator')).setValue('2k70j3e');
    await (await input('Highest frequency')).setValue('29.7');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'LSB' }))).check();
    await (await input('Received on')).setValue('2026-10-30');
    submit(el);
    await fixture.whenStable();
    const req = http.expectOne({ method: 'POST', url: '/api/devices' });
    expect(req.request.body).toEqual({
      clientId: 'cl-2', manufacturer: 'Tidewater Radio', model: 'TW-400', serialNumber: 'TW4-0012', firmware: undefined,
      ratedPepW: 400, emissionDesignator: '2K70J3E',
      // MHz on screen, Hz in the API (shared/schemas/records.ts).
      frequencyMinHz: 1_600_000, frequencyMaxHz: 29_700_000,
      modes: ['USB', 'LSB'], receivedOn: '2026-10-30', condition: 'As received, no visible damage',
    });
    req.flush({ ...stored, id: 'dev-new' });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/plans/new'], { queryParams: { deviceId: 'dev-new' } });
  });

  it('picks the only client by itself', async () => {
    const { loader } = await render(undefined, clients.slice(0, 1));
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toBe('Halyard Marine');
  });

  it('shows what is missing beside each field and sends nothing', async () => {
    const { fixture, el, loader } = await render();
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await fieldErrors(loader, 'Client')).toEqual(['Choose the client who sent the radio.']);
    expect(await fieldErrors(loader, 'Manufacturer')).toEqual(['Enter the manufacturer.']);
    expect(await fieldErrors(loader, 'Model')).toEqual(['Enter the model.']);
    expect(await fieldErrors(loader, 'Serial number')).toEqual(['Enter the serial number.']);
    http.expectNone('/api/devices');
  });

  it('explains a designator that is not one, and a power of 0 W', async () => {
    const { fixture, loader, input } = await render();
    const designator = await input('Emission designator');
    // ITU Radio Regulations Appendix 1: the first symbol after the bandwidth is the main carrier's modulation; 'Z' is none.
    await designator.setValue('2K70Z3E');
    await designator.blur();
    const pep = await input('Rated PEP');
    await pep.setValue('0');
    await pep.blur();
    await fixture.whenStable();
    const [message] = await fieldErrors(loader, 'Emission designator');
    expect(message).toContain("'Z' is not a valid first symbol (modulation of the main carrier)");
    expect(message).not.toContain('parseEmissionDesignator');
    expect(await fieldErrors(loader, 'Rated PEP')).toEqual(['Enter a power above 0 W.']);
  });

  it('asks for a sideband when neither is ticked', async () => {
    const { fixture, el, loader, input } = await render(undefined, clients.slice(0, 1));
    await (await input('Manufacturer')).setValue('Halyard');
    await (await input('Model')).setValue('HX-90');
    await (await input('Serial number')).setValue('SN-1');
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'USB' }))).uncheck();
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(alerts(el)).toEqual(['Choose at least one sideband (USB or LSB).']);
    http.expectNone('/api/devices');
  });

  it('loads a registered device into the form and saves the change with PUT', async () => {
    const { fixture, el, loader, input } = await render('dev-9');
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the device"]')).not.toBeNull();
    http.expectOne({ method: 'GET', url: '/api/devices/dev-9' }).flush(stored);
    await fixture.whenStable();
    expect(el.querySelector('h1')!.textContent).toBe('Change device');
    expect(await (await input('Model')).getValue()).toBe('TW-400');
    expect(await (await input('Highest frequency')).getValue()).toBe('30');
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toBe('Tidewater Radio');
    expect(await (await loader.getHarness(MatCheckboxHarness.with({ label: 'LSB' }))).isChecked()).toBe(true);
    await (await input('Firmware')).setValue('2.2');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/devices/dev-9' });
    expect(req.request.body.firmware).toBe('2.2');
    expect(req.request.body.frequencyMaxHz).toBe(30_000_000);
    req.flush(stored);
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/devices']);
  });

  it('shows a field error of the server under the field it names, in MHz as on screen', async () => {
    const { fixture, el } = await render('dev-9');
    http.expectOne('/api/devices/dev-9').flush(stored);
    await fixture.whenStable();
    submit(el);
    // server/devices/device-checks.ts names the body's field in Hz; the form shows it in MHz.
    http.expectOne({ method: 'PUT', url: '/api/devices/dev-9' }).flush(...problem(422, 'The highest frequency is below the lowest.', [{ pointer: '/frequencyMaxHz', message: 'must be at least the lowest frequency' }]));
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    expect(await fieldErrors(loader, 'Highest frequency')).toEqual(['Must be at least the lowest frequency']);
    expect(await fieldErrors(loader, 'Lowest frequency')).toEqual([]);
    // The product's own wording.
    expect(alerts(el)).toEqual(['Correct the field marked below and try again.']);
  });

  it('shows the server’s refusal of a change and lets the person try again', async () => {
    const { fixture, el } = await render('dev-9');
    http.expectOne('/api/devices/dev-9').flush(stored);
    await fixture.whenStable();
    submit(el);
    http.expectOne({ method: 'PUT', url: '/api/devices/dev-9' }).flush(...problem(409, 'A report was issued on this device: its model and serial number stay as issued.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['A report was issued on this device: its model and serial number stay as issued.']);
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
    expect(navigate).not.toHaveBeenCalled();
  });
});
