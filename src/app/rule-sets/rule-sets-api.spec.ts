import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { RuleSetsApi } from './rule-sets-api';

// Paths, query and bodies are the server's contract (server/rule-sets/routes.ts).
describe('RuleSetsApi', () => {
  let api: RuleSetsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(RuleSetsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lists the latest version of each rule set by name unless told otherwise', () => {
    api.list().subscribe();
    const latest = http.expectOne((r) => r.url === '/api/rule-sets');
    expect(latest.request.params.get('latest')).toBe('true');
    expect(latest.request.params.get('sort')).toBe('name');
    latest.flush({ items: [], total: 0, page: 1, pageSize: 200 });
    api.list({ key: 'our-maritime', latest: false }).subscribe();
    const versions = http.expectOne((r) => r.url === '/api/rule-sets');
    expect(versions.request.params.has('latest')).toBe(false);
    expect(versions.request.params.get('key')).toBe('our-maritime');
    versions.flush({ items: [], total: 0, page: 1, pageSize: 200 });
  });

  it('copies with a name and saves a version with PUT', () => {
    api.copy('s1', 'Our maritime').subscribe();
    const copy = http.expectOne('/api/rule-sets/s1/copy');
    expect(copy.request.method).toBe('POST');
    expect(copy.request.body).toEqual({ name: 'Our maritime' });
    copy.flush({});
    const body = { name: 'Ours', body: {} as never };
    api.saveVersion('r1', body).subscribe();
    const put = http.expectOne('/api/rule-sets/r1');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toBe(body);
    put.flush({}, { status: 201, statusText: 'Created' });
  });
});
