import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { PlansApi } from './plans-api';
import type { CreatePlanBody } from '../../../shared/schemas/records';

// The server's contract: server/plans and server/rule-sets routes.
describe('PlansApi', () => {
  let api: PlansApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(PlansApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('asks for the latest version of every rule set, up to 200', async () => {
    const sets = firstValueFrom(api.ruleSets());
    const req = http.expectOne((r) => r.url === '/api/rule-sets');
    expect(req.request.method).toBe('GET');
    expect(req.request.params.get('latest')).toBe('true');
    expect(req.request.params.get('pageSize')).toBe('200');
    req.flush({ items: [] });
    expect(await sets).toEqual({ items: [] });
  });

  it('posts a plan body unchanged and hands back the stored plan', async () => {
    // Invented ids (test fixtures); 2182 kHz as in the plan form's first test point.
    const body: CreatePlanBody = { deviceId: 'dev-1', ruleSetId: 'rs-1', name: 'Type test', testPoints: [{ kind: 'carrier-suppression', label: '2182 kHz', frequencyHz: 2_182_000, sideband: 'USB' }] };
    const plan = firstValueFrom(api.create(body));
    const req = http.expectOne('/api/plans');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual(body);
    req.flush({ id: 'plan-1', name: 'Type test', deviceId: 'dev-1', testCases: [{ id: 'c1', kind: 'carrier-suppression', label: '2182 kHz' }] });
    expect((await plan).id).toBe('plan-1');
  });
});
