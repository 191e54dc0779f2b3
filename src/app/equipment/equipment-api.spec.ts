import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { EquipmentApi } from './equipment-api';

// The server's contract: server/instruments/routes.ts.
describe('EquipmentApi', () => {
  let api: EquipmentApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(EquipmentApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('filters the register by calibration status and sorts by due date', () => {
    api.list({ status: 'due-soon,overdue', sort: 'calibrationDue', page: 1, pageSize: 25 }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/instruments');
    expect(req.request.params.get('status')).toBe('due-soon,overdue');
    expect(req.request.params.get('sort')).toBe('calibrationDue');
  });

  it('adds with POST and replaces the whole record with PUT', () => {
    const body = { name: 'SA', model: 'M', serialNumber: 'S', calibratedOn: '2026-01-10', calibrationDue: '2027-01-10', certificateRef: 'C-1', contributions: [{ name: 'Cal', budget: 'absolute' as const, distribution: 'normal' as const, value: 0.3, coverageFactor: 2 }] };
    api.create(body).subscribe();
    const post = http.expectOne('/api/instruments');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual(body);
    api.update('i1', body).subscribe();
    expect(http.expectOne('/api/instruments/i1').request.method).toBe('PUT');
    api.get('i1').subscribe();
    expect(http.expectOne('/api/instruments/i1').request.method).toBe('GET');
  });
});
