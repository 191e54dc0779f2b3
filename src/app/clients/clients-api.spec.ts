import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ClientsApi } from './clients-api';

// The server's contract: server/clients/routes.ts and POST /api/clients/:id/invitations.
describe('ClientsApi', () => {
  let api: ClientsApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ClientsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('creates with POST and replaces with PUT', () => {
    const body = { name: 'Maker', addressLines: [], contactName: 'C', contactEmail: 'c@maker.example', invoiceLater: false };
    api.create(body).subscribe();
    expect(http.expectOne('/api/clients').request.method).toBe('POST');
    api.update('c1', body).subscribe();
    const put = http.expectOne('/api/clients/c1');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual(body);
  });

  it('invites the client administrator at the contact address unless another is given', () => {
    api.inviteAdministrator('c1').subscribe();
    expect(http.expectOne('/api/clients/c1/invitations').request.body).toEqual({});
    api.inviteAdministrator('c1', 'boss@maker.example').subscribe();
    expect(http.expectOne('/api/clients/c1/invitations').request.body).toEqual({ email: 'boss@maker.example' });
  });

  it('searches by name', () => {
    api.list({ search: 'hal', sort: 'name' }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/clients');
    expect(req.request.params.get('search')).toBe('hal');
    expect(req.request.params.get('sort')).toBe('name');
  });
});
