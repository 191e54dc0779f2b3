import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { AuditorsPage } from './auditors-page';
import type { AuditorGrantRow } from './auditor-grants-api';
import type { Client } from '../clients/clients-api';
import type { DeviceRow } from '../devices/devices-api';
import { alerts, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented clients, radios and auditors (test fixtures).
const client: Client = { id: 'cl-1', name: 'Halyard Marine', addressLines: [], contactName: 'Mara Quist', contactEmail: 'mara@halyard.example', invoiceLater: false, clientOrganizationId: null, createdAt: '2026-01-01T00:00:00Z' };
const device: DeviceRow = {
  id: 'dev-1', clientId: 'cl-1', manufacturer: 'Halyard', model: 'HX-90', serialNumber: 'SN-7', ratedPepW: 150, emissionDesignator: '2K70J3E',
  frequencyMinHz: 1_600_000, frequencyMaxHz: 27_500_000, modes: ['USB'], receivedOn: '2026-11-01', createdAt: '2026-11-01T00:00:00Z',
};
const grant = (n: number, extra: Partial<AuditorGrantRow> = {}): AuditorGrantRow => ({
  id: `g-${n}`, email: `assessor${n}@body.example`, scope: 'all', clientId: null, deviceId: null, expiresOn: '2026-12-31', note: null,
  status: 'active', acceptedAt: null, revokedAt: null, createdAt: '2026-11-01T00:00:00Z', ...extra,
});

describe('AuditorsPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  const grantsList = () => http.expectOne((r) => r.method === 'GET' && r.url === '/api/auditor-grants');

  async function render(grants: AuditorGrantRow[]) {
    const fixture = TestBed.createComponent(AuditorsPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading auditor access"]')).not.toBeNull();
    grantsList().flush({ items: grants, total: grants.length, page: 1, pageSize: 200 });
    http.expectOne((r) => r.url === '/api/clients').flush({ items: [client], total: 1, page: 1, pageSize: 200 });
    http.expectOne((r) => r.url === '/api/devices' && r.params.get('pageSize') === '200').flush({ items: [device], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const select = async (label: string) => (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatSelectHarness))!;
    return { fixture, el, loader, select };
  }

  it('lists each grant with what it covers in names, its last day and its state', async () => {
    const { el } = await render([grant(1, { note: 'Annual surveillance' }), grant(2, { scope: 'client', clientId: 'cl-1', status: 'pending' }), grant(3, { scope: 'device', deviceId: 'dev-1', status: 'expired' })]);
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(3);
    // The product's own wording.
    expect(rows[0]).toContain('Every issued report');
    expect(rows[0]).toContain('Annual surveillance');
    expect(rows[0]).toContain('31 Dec 2026');
    expect(rows[0]).toContain('Active');
    expect(rows[1]).toContain('Reports of Halyard Marine');
    expect(rows[1]).toContain('Invited');
    expect(rows[2]).toContain('Reports on HX-90 s/n SN-7');
    expect(rows[2]).toContain('Ended');
    expect(el.querySelector('button[aria-label="Revoke access for assessor2@body.example"]')).not.toBeNull();
    expect(el.querySelector('button[aria-label="Revoke access for assessor3@body.example"]')).toBeNull();
  });

  it('says no auditor has access', async () => {
    const { el } = await render([]);
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No auditor has access to your reports.');
  });

  it('grants access to one client’s reports until a last day, with a note', async () => {
    const { fixture, el, loader, select } = await render([]);
    await (await inputLabelled(loader, "Auditor's e-mail")).setValue(' assessor@body.example ');
    const scope = await select('Covers');
    await scope.open();
    await scope.clickOptions({ text: 'Reports of one client' });
    const clientSelect = await select('Client');
    await clientSelect.open();
    await clientSelect.clickOptions({ text: 'Halyard Marine' });
    await (await inputLabelled(loader, 'Last day of access')).setValue('2027-01-31');
    await (await inputLabelled(loader, 'Note for the auditor (optional)')).setValue(' Surveillance visit ');
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/auditor-grants' });
    expect(req.request.body).toEqual({ email: 'assessor@body.example', scope: 'client', clientId: 'cl-1', expiresOn: '2027-01-31', note: 'Surveillance visit' });
    req.flush(grant(4, { email: 'assessor@body.example', scope: 'client', clientId: 'cl-1', expiresOn: '2027-01-31', status: 'pending' }));
    grantsList().flush({ items: [grant(4, { email: 'assessor@body.example', scope: 'client', clientId: 'cl-1', expiresOn: '2027-01-31', status: 'pending' })], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Access for assessor@body.example until 2027-01-31: an invitation is on its way.');
    expect(textOf(el.querySelector('tr.mat-mdc-row'))).toContain('Reports of Halyard Marine');
  });

  it('asks for the device when the access covers one, and for a well-formed address', async () => {
    const { fixture, el, loader, select } = await render([]);
    await (await inputLabelled(loader, "Auditor's e-mail")).setValue('assessor-at-body');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, "Auditor's e-mail")).toEqual(['Enter an e-mail address such as assessor@body.example.']);
    await (await inputLabelled(loader, "Auditor's e-mail")).setValue('assessor@body.example');
    const scope = await select('Covers');
    await scope.open();
    await scope.clickOptions({ text: 'Reports of one device' });
    submit(el);
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Choose the device the access covers.']);
    http.expectNone({ method: 'POST', url: '/api/auditor-grants' });
  });

  it('sends no client or note when access covers every report, and by default runs 30 days', async () => {
    const { loader, el } = await render([]);
    // The page's default is 30 days from today in UTC (settings/auditors-page.ts).
    const expected = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
    expect(await (await inputLabelled(loader, 'Last day of access')).getValue()).toBe(expected);
    await (await inputLabelled(loader, "Auditor's e-mail")).setValue('assessor@body.example');
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/auditor-grants' });
    expect(req.request.body).toEqual({ email: 'assessor@body.example', scope: 'all', expiresOn: expected });
    req.flush(...problem(422, 'The last day must be today or later.'));
  });

  it('revokes a grant and shows a refused one', async () => {
    const { fixture, el } = await render([grant(1)]);
    el.querySelector<HTMLButtonElement>('button[aria-label="Revoke access for assessor1@body.example"]')!.click();
    http.expectOne({ method: 'DELETE', url: '/api/auditor-grants/g-1' }).flush(null);
    grantsList().flush({ items: [grant(1, { status: 'revoked' })], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Access for assessor1@body.example was revoked.');
    expect(textOf(el.querySelector('tr.mat-mdc-row'))).toContain('Revoked');
  });

  it('shows the server’s refusal of a grant', async () => {
    const { fixture, el, loader } = await render([]);
    await (await inputLabelled(loader, "Auditor's e-mail")).setValue('assessor@body.example');
    submit(el);
    http.expectOne({ method: 'POST', url: '/api/auditor-grants' }).flush(...problem(422, 'The last day must be today or later.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['The last day must be today or later.']);
    expect(el.querySelector('[role="status"]')).toBeNull();
  });

  it('shows why the grants could not be listed, without claiming there are none', async () => {
    const fixture = TestBed.createComponent(AuditorsPage);
    await fixture.whenStable();
    grantsList().flush(...problem(403, 'Only a lab administrator can manage auditor access.'));
    http.expectOne((r) => r.url === '/api/clients').flush({ items: [], total: 0, page: 1, pageSize: 200 });
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [], total: 0, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(alerts(el)).toEqual(['Only a lab administrator can manage auditor access.']);
    expect(el.querySelector('.sc-empty')).toBeNull();
  });
});
