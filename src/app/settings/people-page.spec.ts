import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { PeoplePage } from './people-page';
import type { Member, OpenInvitation } from './people-api';
import { SessionStore, type Membership } from '../session/session-store';
import { alerts, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented people (test fixtures).
const me: Member = { userId: 'u-me', name: 'Ines Okafor', email: 'ines@kestrel.example', roles: ['lab-admin'], memberSince: '2026-01-05T00:00:00Z' };
const tomasz: Member = { userId: 'u-2', name: 'Tomasz Wren', email: 'tomasz@kestrel.example', roles: ['engineer'], memberSince: '2026-03-01T00:00:00Z' };
const invitation = (extra: Partial<OpenInvitation> = {}): OpenInvitation => ({
  id: 'inv-1', organizationId: 'org-lab', email: 'new@kestrel.example', role: 'reviewer', status: 'pending', expiresAt: '2026-11-09T10:00:00Z', createdAt: '2026-11-02T10:00:00Z', ...extra,
});

describe('PeoplePage', () => {
  let http: HttpTestingController;
  let membership: Membership;

  beforeEach(() => {
    membership = { organizationId: 'org-lab', kind: 'lab', roles: ['lab-admin'] };
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
    const session = TestBed.inject(SessionStore);
    jest.spyOn(session, 'membership').mockImplementation(() => membership);
    session.user.set({ userId: 'u-me', email: me.email, displayName: me.name, memberships: [membership] });
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  function answer(members: Member[], invitations: OpenInvitation[]) {
    http.expectOne((r) => r.method === 'GET' && r.url === '/api/members' && r.params.get('pageSize') === '200').flush({ items: members, total: members.length, page: 1, pageSize: 200 });
    http.expectOne((r) => r.method === 'GET' && r.url === '/api/invitations').flush({ items: invitations, total: invitations.length, page: 1, pageSize: 200 });
  }

  async function render(members: Member[] = [me, tomasz], invitations: OpenInvitation[] = []) {
    const fixture = TestBed.createComponent(PeoplePage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading members"]')).not.toBeNull();
    answer(members, invitations);
    await fixture.whenStable();
    return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists the members with their roles, marks the person themself and offers no self-removal', async () => {
    const { el, loader } = await render();
    const rows = [...el.querySelectorAll('section[aria-labelledby="members-title"] tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('Ines Okafor (you)');
    expect(rows[1]).toContain('tomasz@kestrel.example');
    const roles = await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Roles of Tomasz Wren' }))).getControl(MatSelectHarness);
    // ROLE_LABELS in shared/access/roles.ts.
    expect(await roles!.getValueText()).toBe('Test engineer');
    expect(el.querySelector('button[aria-label="Remove Ines Okafor"]')).toBeNull();
    expect(el.querySelector('button[aria-label="Remove Tomasz Wren"]')).not.toBeNull();
    // The product's own wording.
    expect(el.textContent).toContain('No invitations waiting to be accepted.');
  });

  it('invites by e-mail with the chosen role and says where the invitation went', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue(' new@kestrel.example ');
    const role = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Role' }))).getControl(MatSelectHarness))!;
    expect(await role.getValueText()).toBe('Test engineer');
    await role.open();
    expect(await Promise.all((await role.getOptions()).map((o) => o.getText()))).toEqual(['Lab administrator', 'Test engineer', 'Technical reviewer', 'Billing']);
    await role.clickOptions({ text: 'Technical reviewer' });
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/invitations' });
    expect(req.request.body).toEqual({ email: 'new@kestrel.example', role: 'reviewer' });
    req.flush(invitation());
    answer([me, tomasz], [invitation()]);
    await fixture.whenStable();
    // The 7 days are the server's (DEVELOPERS.md: invitation links last 7 days); the product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Invitation sent to new@kestrel.example. The link works for 7 days.');
    const invited = textOf(el.querySelector('section[aria-labelledby="invitations-title"] tr.mat-mdc-row'));
    expect(invited).toContain('new@kestrel.example');
    expect(invited).toContain('Technical reviewer');
    expect(await errorsOf(loader, 'E-mail address')).toEqual([]);
  });

  it('offers the manufacturer roles in a manufacturer organization', async () => {
    membership = { organizationId: 'org-m', kind: 'manufacturer', roles: ['manufacturer-admin'] };
    const { loader } = await render([me]);
    const role = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Role' }))).getControl(MatSelectHarness))!;
    expect(await role.getValueText()).toBe('Manufacturer viewer');
    await role.open();
    expect(await Promise.all((await role.getOptions()).map((o) => o.getText()))).toEqual(['Manufacturer administrator', 'Manufacturer viewer']);
  });

  it('refuses a malformed address before sending', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue('tomasz-at-kestrel');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'E-mail address')).toEqual(['Enter an e-mail address such as name@lab.example.']);
    http.expectNone('/api/invitations');
  });

  it('saves changed roles when the role list closes', async () => {
    const { fixture, el, loader } = await render();
    const roles = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Roles of Tomasz Wren' }))).getControl(MatSelectHarness))!;
    await roles.open();
    await roles.clickOptions({ text: 'Technical reviewer' });
    await roles.close();
    const req = http.expectOne({ method: 'PUT', url: '/api/members/u-2/roles' });
    expect(req.request.body).toEqual({ roles: ['engineer', 'reviewer'] });
    req.flush({ userId: 'u-2', roles: ['engineer', 'reviewer'] });
    answer([me, { ...tomasz, roles: ['engineer', 'reviewer'] }], []);
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Tomasz Wren now holds: Test engineer, Technical reviewer.');
  });

  it('keeps at least one role and shows the server’s refusal of a change', async () => {
    const { fixture, el, loader } = await render();
    const roles = (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Roles of Ines Okafor' }))).getControl(MatSelectHarness))!;
    await roles.open();
    await roles.clickOptions({ text: 'Lab administrator' });
    await roles.close();
    // Nothing sent: the page reloads the members instead (the product's own wording).
    answer([me, tomasz], []);
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('Everyone keeps at least one role. To take Ines Okafor out of the organization, remove them instead.');
    await roles.open();
    await roles.clickOptions({ text: 'Billing' });
    await roles.close();
    http.expectOne({ method: 'PUT', url: '/api/members/u-me/roles' }).flush(...problem(409, 'The organization would have no administrator left.'));
    answer([me, tomasz], []);
    await fixture.whenStable();
    // The reload clears the banner before it is read; the refusal must still be on screen.
    expect(alerts(el).join(' ')).toContain('The organization would have no administrator left.');
  });

  it('removes a member after confirmation and withdraws an invitation', async () => {
    const { fixture, el } = await render([me, tomasz], [invitation({ organizationId: 'org-client', organizationName: 'Halyard Marine' })]);
    expect(textOf(el.querySelector('section[aria-labelledby="invitations-title"] tr.mat-mdc-row'))).toContain('into Halyard Marine, your client');
    jest.spyOn(window, 'confirm').mockReturnValue(true);
    el.querySelector<HTMLButtonElement>('button[aria-label="Remove Tomasz Wren"]')!.click();
    http.expectOne({ method: 'DELETE', url: '/api/members/u-2' }).flush(null);
    answer([me], [invitation()]);
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Tomasz Wren was removed.');
    el.querySelector<HTMLButtonElement>('button[aria-label="Withdraw the invitation to new@kestrel.example"]')!.click();
    http.expectOne({ method: 'DELETE', url: '/api/invitations/inv-1' }).flush(null);
    answer([me], []);
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="status"]'))).toBe('The invitation to new@kestrel.example was withdrawn; its link no longer works.');
  });

  it('shows why the members could not be listed, without claiming there are none', async () => {
    const fixture = TestBed.createComponent(PeoplePage);
    await fixture.whenStable();
    http.expectOne((r) => r.url === '/api/members').flush(...problem(403, 'Only an administrator can see the members.'));
    http.expectOne((r) => r.url === '/api/invitations').flush(...problem(403, 'Only an administrator can see the members.'));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(alerts(el)[0]).toContain('Only an administrator can see the members.');
    expect(el.querySelector('.sc-empty')).toBeNull();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
  });
});
