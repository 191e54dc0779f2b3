import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonToggleGroupHarness } from '@angular/material/button-toggle/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { HomePage } from './home-page';
import type { LabHome } from './home-api';
import type { RunRow } from '../runs/runs-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, buttonNamed, problem, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented runs of an invented lab (test fixtures).
const run = (n: number, state: RunRow['state'] = 'testing'): RunRow => ({
  id: `run-${n}`, number: `R-2026-00${n}`, state, updatedAt: '2026-11-02T10:00:00Z', planName: 'Maritime HF J3E',
  manufacturer: 'Halyard Marine Radio Works', model: `HX-${n}0`, serialNumber: `SN${n}`, client: 'Halyard Marine',
});

const emptyHome = (): LabHome => ({
  runsByState: { draft: 0, testing: 0, 'in-review': 0, approved: 0, issued: 0, withdrawn: 0, superseded: 0 },
  awaitingMyReview: [], calibrationDue: [], recentActivity: [],
});

describe('HomePage', () => {
  let http: HttpTestingController;
  let roles: Role[] = ['engineer'];

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => http.verify());

  const runsRequest = (): TestRequest => http.expectOne((r) => r.method === 'GET' && r.url === '/api/runs');

  async function render() {
    const fixture = TestBed.createComponent(HomePage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('shows the loading bars, then one row per run with its stage in words', async () => {
    const { fixture, el } = await render();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading runs"]')).not.toBeNull();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the lab home"]')).not.toBeNull();
    const req = runsRequest();
    // The bench board opens on the engineer's queue, newest change first, 25 a page.
    expect(req.request.params.get('state')).toBe('testing,draft');
    expect(req.request.params.get('sort')).toBe('-updatedAt');
    expect(req.request.params.get('page')).toBe('1');
    expect(req.request.params.get('pageSize')).toBe('25');
    expect(req.request.params.has('search')).toBe(false);
    req.flush({ items: [run(1), run(2, 'draft')], total: 2, page: 1, pageSize: 25 });
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('R-2026-001');
    expect(rows[0]).toContain('HX-10');
    expect(rows[0]).toContain('On the bench');
    expect(rows[1]).toContain('Not started');
    expect(el.querySelector('a[href="/runs/run-1"]')).not.toBeNull();
  });

  it('says so when the queue is empty, and the panels say there is nothing yet', async () => {
    const { fixture, el } = await render();
    runsRequest().flush({ items: [], total: 0, page: 1, pageSize: 25 });
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('.table-card .sc-empty'))).toBe('No runs here. Register a device and build a test plan to start one.');
    expect(el.textContent).toContain('No runs yet.');
    expect(el.textContent).toContain('Nothing waits for your review.');
    expect(el.textContent).toContain('Every instrument is in calibration for the next 30 days.');
    expect(el.textContent).toContain('Nothing has happened yet.');
  });

  it('shows the server’s problem and loads again on Try again', async () => {
    const { fixture, el } = await render();
    runsRequest().flush(...problem(403, 'Your membership does not allow reading runs in this lab.'));
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('Your membership does not allow reading runs in this lab.');
    expect(el.querySelector('.table-card .sc-empty')).toBeNull();
    buttonNamed(el.querySelector('.table-card')!, 'Try again').click();
    runsRequest().flush({ items: [run(3)], total: 1, page: 1, pageSize: 25 });
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    expect(el.querySelectorAll('tr.mat-mdc-row')).toHaveLength(1);
  });

  it('opens the review queue for a reviewer who is not an engineer', async () => {
    roles = ['reviewer'];
    const { fixture, el } = await render();
    expect(runsRequest().request.params.get('state')).toBe('in-review');
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    expect(el.querySelector('a[href="/devices/new"]')).toBeNull();
  });

  it('asks for the chosen queue and the search text', async () => {
    const { fixture, loader } = await render();
    runsRequest().flush({ items: [], total: 0, page: 1, pageSize: 25 });
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    const group = await loader.getHarness(MatButtonToggleGroupHarness);
    const [, awaiting] = await group.getToggles();
    await awaiting.check();
    expect(runsRequest().request.params.get('state')).toBe('in-review');
    const search = await loader.getHarness(MatInputHarness.with({ placeholder: 'Run, model, serial or client' }));
    await search.setValue('  HX-90 ');
    (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('button[aria-label="Search"]')!.click();
    const req = runsRequest();
    expect(req.request.params.get('search')).toBe('HX-90');
    expect(req.request.params.get('state')).toBe('in-review');
    expect(req.request.params.get('page')).toBe('1');
    req.flush({ items: [], total: 0, page: 1, pageSize: 25 });
  });

  it('fills the panels: counts that open their queue, reviews waiting, instruments falling due', async () => {
    const { fixture, el } = await render();
    runsRequest().flush({ items: [], total: 0, page: 1, pageSize: 25 });
    const home = emptyHome();
    home.runsByState = { ...home.runsByState, testing: 3, 'in-review': 1 };
    home.awaitingMyReview = [{ id: 'run-7', number: 'R-2026-007', state: 'in-review', updatedAt: '2026-11-02T10:00:00Z', engineerId: 'u-2', manufacturer: 'Halyard', model: 'HX-90', serialNumber: 'SN7', client: 'Halyard Marine' }];
    home.calibrationDue = [{ id: 'i-1', name: 'Spectrum analyzer', model: 'SA-3', serialNumber: 'SA3-1', calibrationDue: '2026-11-20', certificateRef: 'C-1', calibrationStatus: 'due-soon' }];
    http.expectOne('/api/home').flush(home);
    await fixture.whenStable();
    expect(el.querySelector('a[href="/runs/run-7/review"]')).not.toBeNull();
    expect(el.textContent).toContain('Spectrum analyzer');
    expect(el.textContent).toContain('due 20 Nov 2026');
    expect(el.textContent).toContain('Due within 30 days');
    const counts = [...el.querySelectorAll<HTMLButtonElement>('button.count-button')];
    expect(counts.map(textOf)).toEqual(['On the bench3: show them in the work queue', 'Awaiting review1: show them in the work queue']);
    counts[1].click();
    expect(runsRequest().request.params.get('state')).toBe('in-review');
  });

  it('shows the panels’ own error with a way to try again', async () => {
    const { fixture, el } = await render();
    runsRequest().flush({ items: [], total: 0, page: 1, pageSize: 25 });
    http.expectOne('/api/home').flush(...problem(500, 'The lab home could not be read.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('The lab home could not be read.');
    buttonNamed(el.querySelector('sc-home-panels')!, 'Try again').click();
    http.expectOne('/api/home').flush(emptyHome());
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
  });
});
