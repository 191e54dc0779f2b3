import { TestBed } from '@angular/core/testing';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { authInterceptor } from './auth-interceptor';
import { SessionStore } from './session-store';

const answer = (token: string) => ({
  accessToken: token,
  expiresIn: 600,
  user: { userId: 'u', email: 'e@x.example', displayName: 'E', memberships: [{ organizationId: 'org-9', kind: 'lab', roles: ['engineer'] }] },
});

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let session: SessionStore;

  beforeEach(async () => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(SessionStore);
    const done = session.signIn('e@x.example', 'pw');
    backend.expectOne('/api/auth/sign-in').flush(answer('old'));
    await done;
  });

  it('sends the bearer token and the active organization', async () => {
    const p = firstValueFrom(http.get('/api/devices'));
    const req = backend.expectOne('/api/devices');
    expect(req.request.headers.get('Authorization')).toBe('Bearer old');
    expect(req.request.headers.get('X-Organization-Id')).toBe('org-9');
    req.flush({ items: [] });
    await p;
  });

  it('refreshes once on 401 and retries with the new token', async () => {
    const p = firstValueFrom(http.get<{ ok: boolean }>('/api/runs'));
    backend.expectOne('/api/runs').flush({ detail: 'expired' }, { status: 401, statusText: 'Unauthorized' });
    await Promise.resolve();
    backend.expectOne('/api/auth/refresh').flush(answer('new'));
    await new Promise((r) => setTimeout(r));
    const retry = backend.expectOne('/api/runs');
    expect(retry.request.headers.get('Authorization')).toBe('Bearer new');
    retry.flush({ ok: true });
    expect(await p).toEqual({ ok: true });
  });
});
