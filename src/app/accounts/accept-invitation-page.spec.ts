import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { AcceptInvitationPage } from './accept-invitation-page';
import type { InvitationLookup } from './accounts-api';
import { SessionStore } from '../session/session-store';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, settle, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented organizations and people (test fixtures).
const lookup = (extra: Partial<InvitationLookup> = {}): InvitationLookup => ({
  kind: 'member', organizationName: 'Kestrel Bay Radio Test Laboratory', organizationKind: 'lab', role: 'engineer', roleLabel: 'Test engineer',
  email: 'tomasz@kestrel.example', accountExists: false, expiresAt: '2026-11-09T10:00:00Z', grant: null, ...extra,
});
const session = (organizationId: string) => ({ accessToken: 't', expiresIn: 600, user: { userId: 'u-2', email: 'tomasz@kestrel.example', displayName: 'Tomasz Wren', memberships: [{ organizationId, kind: 'lab', roles: ['engineer'] }] } });

describe('AcceptInvitationPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  async function render(found: InvitationLookup | null, token = 'tok/1') {
    const fixture = TestBed.createComponent(AcceptInvitationPage);
    fixture.componentRef.setInput('token', token);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Reading the invitation"]')).not.toBeNull();
    const req = http.expectOne({ method: 'GET', url: '/api/invitations/lookup/tok%2F1' });
    if (found) req.flush(found);
    else req.flush(...problem(410, 'This invitation was already used. Ask for a new one.'));
    await fixture.whenStable();
    return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('says who invites whom as what, and asks a newcomer for a name and password', async () => {
    const { el, loader } = await render(lookup());
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    const text = textOf(el.querySelector('form'));
    expect(text).toContain('Kestrel Bay Radio Test Laboratory invites tomasz@kestrel.example to join as Test engineer.');
    expect(text).toContain('The link works once, until 9 Nov 2026');
    expect(await (await inputLabelled(loader, 'Your name')).getValue()).toBe('');
  });

  it('creates the account, signs in to the inviting lab and opens its bench board', async () => {
    const { fixture, el, loader } = await render(lookup());
    await (await inputLabelled(loader, 'Your name')).setValue(' Tomasz Wren ');
    await (await inputLabelled(loader, 'Password')).setValue('bench two 2026');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Accepting the invitation"]')).not.toBeNull();
    const req = http.expectOne({ method: 'POST', url: '/api/invitations/accept' });
    expect(req.request.withCredentials).toBe(true);
    expect(req.request.body).toEqual({ token: 'tok/1', name: 'Tomasz Wren', password: 'bench two 2026' });
    req.flush({ accountCreated: true, kind: 'member', organizationId: 'org-lab' });
    await settle(fixture);
    http.expectOne({ method: 'POST', url: '/api/auth/refresh' }).flush(session('org-lab'));
    await settle(fixture);
    expect(TestBed.inject(SessionStore).activeOrganizationId()).toBe('org-lab');
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('sends a new auditor to the auditor’s page', async () => {
    const auditor = await render(lookup({ kind: 'auditor', role: null, roleLabel: null, grant: { scope: 'all', expiresOn: '2026-12-31' } }));
    expect(textOf(auditor.el.querySelector('form'))).toContain('Kestrel Bay Radio Test Laboratory gives tomasz@kestrel.example read-only access to its issued reports until 2026-12-31.');
    await (await inputLabelled(auditor.loader, 'Your name')).setValue('Ana Assessor');
    await (await inputLabelled(auditor.loader, 'Password')).setValue('assessment 2026');
    submit(auditor.el);
    http.expectOne('/api/invitations/accept').flush({ accountCreated: true, kind: 'auditor', organizationId: 'org-lab' });
    await settle(auditor.fixture);
    http.expectOne('/api/auth/refresh').flush(session('org-lab'));
    await settle(auditor.fixture);
    expect(navigate).toHaveBeenLastCalledWith('/auditor');
  });

  it('only confirms for an address that has an account, then asks to sign in as usual', async () => {
    const { fixture, el } = await render(lookup({ accountExists: true }));
    expect(el.textContent).toContain('This address already has a Sidecheck account: accepting adds this access to it.');
    expect(el.querySelector('input')).toBeNull();
    buttonNamed(el, 'Accept the invitation').click();
    const req = http.expectOne({ method: 'POST', url: '/api/invitations/accept' });
    expect(req.request.body).toEqual({ token: 'tok/1' });
    req.flush({ accountCreated: false, kind: 'member', organizationId: 'org-lab' });
    await settle(fixture);
    // The product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('You now have access to Kestrel Bay Radio Test Laboratory. Sign in with your usual password to continue.');
    expect(el.querySelector('a[href="/sign-in"]')).not.toBeNull();
    http.expectNone('/api/auth/refresh');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('asks for a name and a strong enough password before sending', async () => {
    const { fixture, el, loader } = await render(lookup());
    await (await inputLabelled(loader, 'Password')).setValue('abcdefghijkl');
    submit(el);
    await fixture.whenStable();
    // The product's own wording (rule of server/auth/password.ts).
    expect(await errorsOf(loader, 'Your name')).toEqual(['Enter your name.']);
    expect(await errorsOf(loader, 'Password')).toEqual(['Use letters and at least one digit.']);
    http.expectNone('/api/invitations/accept');
  });

  it('shows why a used or expired link cannot be opened, with a way to sign in', async () => {
    const { el } = await render(null);
    expect(alerts(el)).toEqual(['This invitation was already used. Ask for a new one.']);
    expect(el.querySelector('a[href="/sign-in"]')).not.toBeNull();
    expect(el.querySelector('button[type="submit"]')).toBeNull();
  });

  it('shows the server’s refusal of the acceptance', async () => {
    const { fixture, el } = await render(lookup({ accountExists: true }));
    buttonNamed(el, 'Accept the invitation').click();
    http.expectOne('/api/invitations/accept').flush(...problem(410, 'This invitation expired on 9 November. Ask for a new one.'));
    await settle(fixture);
    expect(alerts(el)).toEqual(['This invitation expired on 9 November. Ask for a new one.']);
    expect(el.querySelector('[role="status"]')).toBeNull();
  });
});
