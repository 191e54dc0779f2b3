import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonToggleGroupHarness } from '@angular/material/button-toggle/testing';
import { MatSortHarness } from '@angular/material/sort/testing';
import { EquipmentPage } from './equipment-page';
import type { Instrument } from './equipment-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, buttonNamed, inputLabelled, problem, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented instruments (test fixtures).
const instrument = (n: number, status: Instrument['calibrationStatus'], contributions = 1): Instrument => ({
  id: `in-${n}`, name: `Spectrum analyzer ${n}`, model: 'SA-3', serialNumber: `SA3-${n}`, calibratedOn: '2025-11-20', calibrationDue: '2026-11-20',
  certificateRef: `CAL-${n}`, calibrationStatus: status, createdAt: '2025-11-21T00:00:00Z', updatedAt: '2025-11-21T00:00:00Z',
  contributions: Array.from({ length: contributions }, (_, i) => ({ name: `c${i}`, budget: 'relative' as const, distribution: 'rectangular' as const, value: 0.5 })),
});

describe('EquipmentPage', () => {
  let http: HttpTestingController;
  let roles: Role[];

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => http.verify());

  const listRequest = (): TestRequest => http.expectOne((r) => r.method === 'GET' && r.url === '/api/instruments');
  const page = (items: Instrument[]) => ({ items, total: items.length, page: 1, pageSize: 25 });

  async function render() {
    const fixture = TestBed.createComponent(EquipmentPage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('asks for the soonest due first and shows each instrument with its status in words', async () => {
    const { fixture, el } = await render();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading instruments"]')).not.toBeNull();
    const req = listRequest();
    expect(req.request.params.get('sort')).toBe('calibrationDue');
    expect(req.request.params.get('page')).toBe('1');
    expect(req.request.params.get('pageSize')).toBe('25');
    expect(req.request.params.has('status')).toBe(false);
    req.flush(page([instrument(1, 'overdue', 1), instrument(2, 'valid', 2)]));
    await fixture.whenStable();
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('Spectrum analyzer 1');
    expect(rows[0]).toContain('1 uncertainty contributionSA3-1');
    expect(rows[1]).toContain('2 uncertainty contributions');
    expect(rows[0]).toContain('20 Nov 2026');
    expect(rows[0]).toContain('calibrated 20 Nov 2025');
    expect(rows[0]).toContain('Overdue');
    expect(rows[1]).toContain('Valid');
    expect(el.querySelector('a[aria-label="Change Spectrum analyzer 1 SA3-1"]')!.getAttribute('href')).toBe('/equipment/in-1/edit');
  });

  it('filters by status and search, and sorts by the chosen column', async () => {
    const { fixture, el, loader } = await render();
    listRequest().flush(page([]));
    await fixture.whenStable();
    const toggles = await (await loader.getHarness(MatButtonToggleGroupHarness)).getToggles({ text: 'Overdue' });
    await toggles[0].check();
    let req = listRequest();
    expect(req.request.params.get('status')).toBe('overdue');
    req.flush(page([]));
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No instruments match this filter.');
    await (await inputLabelled(loader, 'Search instruments')).setValue('CAL-7');
    buttonNamed(el, 'Search').click();
    req = listRequest();
    expect(req.request.params.get('search')).toBe('CAL-7');
    expect(req.request.params.get('status')).toBe('overdue');
    req.flush(page([]));
    const [serial] = await (await loader.getHarness(MatSortHarness)).getSortHeaders({ label: 'Serial' });
    await serial.click();
    expect(listRequest().request.params.get('sort')).toBe('serialNumber');
  });

  it('says the register is empty, and offers the add button only to those who may write', async () => {
    roles = ['reviewer'];
    const { fixture, el } = await render();
    listRequest().flush(page([]));
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No instruments in the register yet.');
    expect(el.querySelector('a[href="/equipment/new"]')).toBeNull();
  });

  it('shows the server’s problem and tries again', async () => {
    const { fixture, el } = await render();
    listRequest().flush(...problem(400, 'Unknown status “lost”: use valid, due-soon or overdue.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('Unknown status “lost”: use valid, due-soon or overdue.');
    expect(el.querySelector('.sc-empty')).toBeNull();
    buttonNamed(el, 'Try again').click();
    listRequest().flush(page([instrument(1, 'due-soon')]));
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    expect(textOf(el.querySelector('tr.mat-mdc-row'))).toContain('Due within 30 days');
  });
});
