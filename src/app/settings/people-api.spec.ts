import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PeopleApi } from './people-api';

// The server's contract: server/accounts/member-routes.ts and invitation-routes.ts.
describe('PeopleApi', () => {
  let api: PeopleApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(PeopleApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lists members with the largest page the server allows and leaves out an empty search', () => {
    api.members({ search: '' }).subscribe();
    const req = http.expectOne((r) => r.url === '/api/members');
    expect(req.request.params.get('pageSize')).toBe('200');
    expect(req.request.params.has('search')).toBe(false);
    req.flush({ items: [], total: 0, page: 1, pageSize: 200 });
  });

  it('replaces roles with PUT, removes with DELETE and escapes ids', () => {
    api.setRoles('u/1', ['engineer', 'reviewer']).subscribe();
    const put = http.expectOne('/api/members/u%2F1/roles');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ roles: ['engineer', 'reviewer'] });
    put.flush({});
    api.removeMember('u2').subscribe();
    expect(http.expectOne('/api/members/u2').request.method).toBe('DELETE');
  });

  it('invites with an address and a role, lists and revokes invitations', () => {
    api.invite({ email: 'new@lab.example', role: 'engineer' }).subscribe();
    const post = http.expectOne('/api/invitations');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ email: 'new@lab.example', role: 'engineer' });
    post.flush({});
    api.invitations().subscribe();
    http.expectOne((r) => r.url === '/api/invitations' && r.method === 'GET').flush({ items: [] });
    api.revokeInvitation('i1').subscribe();
    expect(http.expectOne('/api/invitations/i1').request.method).toBe('DELETE');
  });
});
