import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { DevicesPage } from './devices-page';
import type { DeviceRow } from './devices-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, problem, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented radios (test fixtures).
const device = (n: number): DeviceRow => ({
  id: `dev-${n}`, clientId: 'cl-1', manufacturer: 'Halyard Marine Radio Works', model: `HX-${n}0`, serialNumber: `SN-${n}`,
  ratedPepW: 125.5, emissionDesignator: '2K70J3E', frequencyMinHz: 1_600_000, frequencyMaxHz: 27_500_000, modes: ['USB'],
  receivedOn: '2026-11-01', createdAt: '2026-11-01T09:00:00Z',
});

describe('DevicesPage', () => {
  let http: HttpTestingController;
  let roles: Role[];

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(DevicesPage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  it('loads up to 100 devices while showing a loading bar, then one row per device', async () => {
    const { fixture, el } = await render();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading devices"]')).not.toBeNull();
    const req = http.expectOne((r) => r.method === 'GET' && r.url === '/api/devices');
    expect(req.request.params.get('pageSize')).toBe('100');
    req.flush({ items: [device(1), device(2)], total: 2, page: 1, pageSize: 100 });
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('HX-10');
    expect(rows[0]).toContain('SN-1');
    expect(rows[0]).toContain('2K70J3E');
    // One decimal at most (the page's number format '1.0-1').
    expect(rows[0]).toContain('125.5 W');
  });

  it('offers change and plan links to an engineer, each named for its device', async () => {
    const { fixture, el } = await render();
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [device(1)], total: 1, page: 1, pageSize: 100 });
    await fixture.whenStable();
    expect(el.querySelector('a[href="/devices/new"]')).not.toBeNull();
    const change = el.querySelector('a[href="/devices/dev-1/edit"]')!;
    expect(change.getAttribute('aria-label')).toBe('Change HX-10 s/n SN-1');
    expect(el.querySelector('a[href="/plans/new?deviceId=dev-1"]')).not.toBeNull();
  });

  it('offers no changes to a reviewer', async () => {
    roles = ['reviewer'];
    const { fixture, el } = await render();
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [device(1)], total: 1, page: 1, pageSize: 100 });
    await fixture.whenStable();
    expect(el.querySelector('a[href="/devices/new"]')).toBeNull();
    expect(el.querySelector('a[href="/devices/dev-1/edit"]')).toBeNull();
  });

  it('says there are no devices yet', async () => {
    const { fixture, el } = await render();
    http.expectOne((r) => r.url === '/api/devices').flush({ items: [], total: 0, page: 1, pageSize: 100 });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No devices yet.');
  });

  it('shows the server’s problem instead of an empty list', async () => {
    const { fixture, el } = await render();
    http.expectOne((r) => r.url === '/api/devices').flush(...problem(403, 'Choose a lab to see its devices.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Choose a lab to see its devices.']);
    expect(el.querySelector('.sc-empty')).toBeNull();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
  });
});
