import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { SessionStore } from './session-store';

const user = (orgs: string[]) => ({
  userId: 'u1',
  email: 'a@lab.example',
  displayName: 'A Person',
  memberships: orgs.map((id) => ({ organizationId: id, kind: 'lab' as const, roles: ['engineer' as const] })),
});

describe('SessionStore', () => {
  let store: SessionStore;
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(SessionStore);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('keeps the access token in memory and picks the first organization', async () => {
    const done = store.signIn('a@lab.example', 'pw');
    const req = http.expectOne('/api/auth/sign-in');
    expect(req.request.withCredentials).toBe(true);
    req.flush({ accessToken: 'tok', expiresIn: 600, user: user(['org-1', 'org-2']) });
    await done;
    expect(store.accessToken()).toBe('tok');
    expect(store.membership()?.organizationId).toBe('org-1');
    expect(store.hasRole('engineer')).toBe(true);
    expect(store.hasRole('reviewer')).toBe(false);
    expect(localStorage.getItem('sidecheck.accessToken')).toBeNull();
  });

  it('shares one refresh between concurrent callers and clears the session when it fails', async () => {
    const a = store.refresh();
    const b = store.refresh();
    http.expectOne('/api/auth/refresh').flush({ detail: 'ended' }, { status: 401, statusText: 'Unauthorized' });
    expect(await a).toBe(false);
    expect(await b).toBe(false);
    expect(store.user()).toBeNull();
  });

  it('remembers the organization switched to', async () => {
    const done = store.signIn('a@lab.example', 'pw');
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'tok', expiresIn: 600, user: user(['org-1', 'org-2']) });
    await done;
    store.switchOrganization('org-2');
    expect(store.membership()?.organizationId).toBe('org-2');
    expect(localStorage.getItem('sidecheck.activeOrganization')).toBe('org-2');
  });
});
