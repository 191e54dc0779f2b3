import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { RunsApi, type SavedReading } from './runs-api';

// The server's contract: server/runs/routes.ts.
describe('RunsApi', () => {
  let api: RunsApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(RunsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lists runs with the given query, leaving out empty and missing values', async () => {
    const page = firstValueFrom(api.list({ page: 2, pageSize: 25, sort: '-updatedAt', state: 'testing,draft', search: '' }));
    const req = http.expectOne((r) => r.url === '/api/runs');
    expect(req.request.method).toBe('GET');
    expect(req.request.params.toString()).toBe('page=2&pageSize=25&sort=-updatedAt&state=testing,draft');
    req.flush({ items: [], total: 0, page: 2, pageSize: 25 });
    expect(await page).toEqual({ items: [], total: 0, page: 2, pageSize: 25 });
  });

  it('reads a run by id and starts a run from a plan', async () => {
    const run = firstValueFrom(api.get('run/1'));
    http.expectOne({ method: 'GET', url: '/api/runs/run%2F1' }).flush({ id: 'run/1', number: 'R-1' });
    expect((await run).number).toBe('R-1');
    const created = firstValueFrom(api.create('plan-1'));
    const req = http.expectOne('/api/runs');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ planId: 'plan-1' });
    req.flush({ id: 'run-2' });
    expect((await created).id).toBe('run-2');
  });

  it('saves a reading’s raw values with PUT and hands back the stored result', async () => {
    // A carrier-suppression reading (keys of shared/evaluation/reading-fields.ts; invented values, test fixture).
    const values = { pepDbm: 50, carrierDbm: 5, note: null };
    const saved = firstValueFrom(api.saveReading('run-1', 'case 1', values));
    const req = http.expectOne('/api/runs/run-1/cases/case%201/reading');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ values });
    const answer = { reading: { id: 'rd-1', values, createdAt: '2026-11-02T10:00:00Z' }, result: null, problem: 'Choose the instruments first.' } as SavedReading;
    req.flush(answer);
    expect(await saved).toEqual(answer);
  });

  it('posts each transition, with a reason only when one is given', () => {
    api.act('run-1', 'submit').subscribe();
    let req = http.expectOne('/api/runs/run-1/submit');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({});
    api.act('run-1', 'return', 'Read the IMD again at full power.').subscribe();
    req = http.expectOne('/api/runs/run-1/return');
    expect(req.request.body).toEqual({ reason: 'Read the IMD again at full power.' });
    api.act('run-1', 'approve').subscribe();
    expect(http.expectOne('/api/runs/run-1/approve').request.method).toBe('POST');
    api.act('run-1', 'issue').subscribe();
    expect(http.expectOne('/api/runs/run-1/issue').request.body).toEqual({});
  });

  it('replaces the run’s instruments with the whole set', async () => {
    const run = firstValueFrom(api.setInstruments('run-1', ['in-1', 'in-2']));
    const req = http.expectOne('/api/runs/run-1/instruments');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual({ instrumentIds: ['in-1', 'in-2'] });
    req.flush({ id: 'run-1', instruments: [] });
    expect((await run).id).toBe('run-1');
  });
});
