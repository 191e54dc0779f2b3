import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter, type ActivatedRouteSnapshot, type RouterStateSnapshot, type UrlTree } from '@angular/router';
import { SessionStore } from '../session/session-store';
import { roleGuard } from './role-guard';
import { SCREEN_ROLES } from './screen-roles';
import type { Role } from '../../../shared/access/roles';

async function signedInAs(kind: 'lab' | 'manufacturer', roles: Role[]): Promise<void> {
  const session = TestBed.inject(SessionStore);
  const done = session.signIn('a@x.example', 'pw');
  TestBed.inject(HttpTestingController)
    .expectOne('/api/auth/sign-in')
    .flush({ accessToken: 't', expiresIn: 600, user: { userId: 'u', email: 'a@x.example', displayName: 'A', memberships: [{ organizationId: 'o1', kind, roles }] } });
  await done;
}

const run = (roles: readonly Role[]) =>
  TestBed.runInInjectionContext(() => roleGuard(roles)({} as ActivatedRouteSnapshot, {} as RouterStateSnapshot)) as boolean | UrlTree;

describe('roleGuard', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
  });

  it('lets a lab administrator into the settings', async () => {
    await signedInAs('lab', ['lab-admin']);
    expect(run(SCREEN_ROLES.labAdmin)).toBe(true);
  });

  it('sends an engineer who opens the settings back to the lab home', async () => {
    await signedInAs('lab', ['engineer']);
    const url = run(SCREEN_ROLES.labAdmin) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(url)).toBe('/');
  });

  it('sends a manufacturer viewer who opens the equipment register to their reports', async () => {
    await signedInAs('manufacturer', ['manufacturer-viewer']);
    const url = run(SCREEN_ROLES.labRecords) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(url)).toBe('/reports');
  });

  it('lets a manufacturer administrator manage their people but not the lab-only settings', async () => {
    await signedInAs('manufacturer', ['manufacturer-admin']);
    expect(run(SCREEN_ROLES.people)).toBe(true);
    expect(run(SCREEN_ROLES.labAdmin)).not.toBe(true);
  });
});
