import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { AccountsApi } from './accounts-api';

// The paths and bodies are the server's contract (server/accounts/routes.ts, invitation-routes.ts).
describe('AccountsApi', () => {
  let api: AccountsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(AccountsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('signs up with credentials so the refresh cookie is kept', async () => {
    const body = { labName: 'Lab', address: ['1 Road'], name: 'N', email: 'n@lab.example', password: 'long enough 1' };
    const p = firstValueFrom(api.signUp(body));
    const req = http.expectOne('/api/auth/sign-up');
    expect(req.request.method).toBe('POST');
    expect(req.request.withCredentials).toBe(true);
    expect(req.request.body).toEqual(body);
    req.flush({ organizationId: 'o1' });
    expect(await p).toEqual({ organizationId: 'o1' });
  });

  it('escapes the token when looking up an invitation', () => {
    api.lookupInvitation('a/b').subscribe();
    http.expectOne('/api/invitations/lookup/a%2Fb').flush({});
  });

  it('accepts an invitation and completes a password reset with the token in the body', () => {
    api.acceptInvitation({ token: 't', name: 'N', password: 'p' }).subscribe();
    const accept = http.expectOne('/api/invitations/accept');
    expect(accept.request.body).toEqual({ token: 't', name: 'N', password: 'p' });
    expect(accept.request.withCredentials).toBe(true);
    accept.flush({ accountCreated: true, kind: 'member', organizationId: 'o' });
    api.completePasswordReset('t2', 'new password 1').subscribe();
    expect(http.expectOne('/api/auth/password-reset/complete').request.body).toEqual({ token: 't2', password: 'new password 1' });
  });

  it('asks for a reset link by address only', () => {
    api.requestPasswordReset('a@lab.example').subscribe();
    const req = http.expectOne('/api/auth/password-reset/request');
    expect(req.request.body).toEqual({ email: 'a@lab.example' });
    req.flush({ detail: 'If an account uses this address…' }, { status: 202, statusText: 'Accepted' });
  });
});
