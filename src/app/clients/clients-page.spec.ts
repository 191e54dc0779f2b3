import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ClientsPage } from './clients-page';
import type { Client } from './clients-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, buttonNamed, inputLabelled, problem, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented clients (test fixtures).
const client = (name: string, portal: boolean): Client => ({
  id: `cl-${name.length}`, name, addressLines: ['4 Quay Road', 'Portsmouth PO1 3AB'], contactName: 'Mara Quist', contactEmail: 'mara@halyard.example',
  invoiceLater: false, clientOrganizationId: portal ? 'org-m' : null, createdAt: '2026-10-01T00:00:00Z',
});

describe('ClientsPage', () => {
  let http: HttpTestingController;
  let roles: Role[];

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => http.verify());

  const listRequest = (): TestRequest => http.expectOne((r) => r.method === 'GET' && r.url === '/api/clients');

  async function render() {
    const fixture = TestBed.createComponent(ClientsPage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('asks for the clients by name and shows one row each, with how they get their reports', async () => {
    const { fixture, el } = await render();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading clients"]')).not.toBeNull();
    const req = listRequest();
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('pageSize')).toBe('200');
    expect(req.request.params.has('search')).toBe(false);
    req.flush({ items: [client('Halyard Marine', true), client('Tidewater Radio Co', false)], total: 2, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('4 Quay Road, Portsmouth PO1 3AB');
    expect(rows[0]).toContain('mara@halyard.example');
    // The product's own wording.
    expect(rows[0]).toContain('On Sidecheck');
    expect(rows[1]).toContain('By e-mail only');
    expect(el.querySelector('a[aria-label="Change Halyard Marine"]')!.getAttribute('href')).toBe('/clients/cl-14/edit');
    expect(el.querySelector('a[href="/clients/new"]')).not.toBeNull();
  });

  it('offers no changes to a reviewer', async () => {
    roles = ['reviewer'];
    const { fixture, el } = await render();
    listRequest().flush({ items: [client('Halyard Marine', true)], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(el.querySelector('a[href="/clients/new"]')).toBeNull();
    expect(el.querySelector('a[aria-label="Change Halyard Marine"]')).toBeNull();
  });

  it('searches by the typed text and says when nothing matches', async () => {
    const { fixture, el, loader } = await render();
    listRequest().flush({ items: [], total: 0, page: 1, pageSize: 200 });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No clients yet.');
    await (await inputLabelled(loader, 'Search clients')).setValue('Tidewater');
    el.querySelector<HTMLButtonElement>('button[aria-label="Search"]')!.click();
    const req = listRequest();
    expect(req.request.params.get('search')).toBe('Tidewater');
    req.flush({ items: [], total: 0, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No clients match “Tidewater”.');
  });

  it('shows the server’s problem and tries again on request', async () => {
    const { fixture, el } = await render();
    listRequest().flush(...problem(503, 'The database is restarting; try again in a minute.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('The database is restarting; try again in a minute.');
    expect(el.querySelector('.sc-empty')).toBeNull();
    buttonNamed(el, 'Try again').click();
    listRequest().flush({ items: [client('Halyard Marine', false)], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    expect(el.querySelectorAll('tr.mat-mdc-row')).toHaveLength(1);
  });
});
