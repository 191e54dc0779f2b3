import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { InstrumentRegisterApi } from './instrument-register-api';

// The server's contract: GET /api/instruments (server/instruments/routes.ts).
describe('InstrumentRegisterApi', () => {
  let api: InstrumentRegisterApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(InstrumentRegisterApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lists up to 200 instruments by name, with a trimmed search only when one is typed', async () => {
    const page = firstValueFrom(api.list());
    const all = http.expectOne((r) => r.url === '/api/instruments');
    expect(all.request.method).toBe('GET');
    expect(all.request.params.toString()).toBe('pageSize=200&sort=name');
    all.flush({ items: [], total: 0, page: 1, pageSize: 200 });
    expect((await page).items).toEqual([]);
    api.list('  SA3 ').subscribe();
    expect(http.expectOne((r) => r.url === '/api/instruments').request.params.toString()).toBe('pageSize=200&sort=name&search=SA3');
    api.list('   ').subscribe();
    expect(http.expectOne((r) => r.url === '/api/instruments').request.params.has('search')).toBe(false);
  });
});
