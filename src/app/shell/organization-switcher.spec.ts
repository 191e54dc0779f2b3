import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { SessionStore } from '../session/session-store';
import { OrganizationSwitcher } from './organization-switcher';

const memberships = [
  { organizationId: 'aaaaaaaa-0001', organizationName: 'Kestrel Bay Radio Test Laboratory', kind: 'lab', roles: ['lab-admin'] },
  { organizationId: 'bbbbbbbb-0002', organizationName: 'Halyard Marine Radio Works', kind: 'manufacturer', roles: ['manufacturer-viewer'] },
];

async function signIn(list: typeof memberships): Promise<void> {
  const done = TestBed.inject(SessionStore).signIn('a@x.example', 'pw');
  TestBed.inject(HttpTestingController).expectOne('/api/auth/sign-in').flush({ accessToken: 't', expiresIn: 600, user: { userId: 'u', email: 'a@x.example', displayName: 'A', memberships: list } });
  await done;
}

describe('OrganizationSwitcher', () => {
  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
  });

  it('names the organizations, never their ids, and switches on choice', async () => {
    await signIn(memberships);
    const fixture = TestBed.createComponent(OrganizationSwitcher);
    await fixture.whenStable();
    const button: HTMLButtonElement = fixture.nativeElement.querySelector('button');
    expect(button.textContent).toContain('Kestrel Bay Radio Test Laboratory');
    expect(button.querySelector('.visually-hidden')!.textContent).toBe('Organization: ');
    expect(fixture.nativeElement.textContent).not.toContain('aaaaaaaa');
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    (fixture.componentInstance as OrganizationSwitcher).switchTo('bbbbbbbb-0002');
    await fixture.whenStable();
    expect(TestBed.inject(SessionStore).membership()?.organizationId).toBe('bbbbbbbb-0002');
    expect(button.textContent).toContain('Halyard Marine Radio Works');
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('shows the single organization as a label', async () => {
    await signIn(memberships.slice(0, 1));
    const fixture = TestBed.createComponent(OrganizationSwitcher);
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('button')).toBeNull();
    expect(fixture.nativeElement.querySelector('.label').textContent).toBe('Kestrel Bay Radio Test Laboratory');
  });
});
