import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { ApiKeysApi } from './api-keys-api';

// The server's contract: server/api-keys/routes.ts (the key is in the creation answer only).
describe('ApiKeysApi', () => {
  let api: ApiKeysApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ApiKeysApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('makes a key by name and hands back the one-time secret', async () => {
    const p = firstValueFrom(api.create('Bench 2'));
    const req = http.expectOne('/api/api-keys');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ name: 'Bench 2' });
    req.flush({ id: 'k1', name: 'Bench 2', prefix: 'sck_abcd', key: 'sck_abcd_secret' });
    expect((await p).key).toBe('sck_abcd_secret');
  });

  it('lists and revokes', () => {
    api.list().subscribe();
    http.expectOne((r) => r.url === '/api/api-keys' && r.params.get('pageSize') === '200').flush({ items: [] });
    api.revoke('k1').subscribe();
    expect(http.expectOne('/api/api-keys/k1').request.method).toBe('DELETE');
  });
});
