import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { ClientFormPage } from './client-form-page';
import type { Client } from './clients-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, settle, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// An invented client (test fixture).
const stored: Client = {
  id: 'cl-1', name: 'Halyard Marine', addressLines: ['4 Quay Road', 'Portsmouth PO1 3AB'], contactName: 'Mara Quist',
  contactEmail: 'mara@halyard.example', invoiceLater: false, clientOrganizationId: null, createdAt: '2026-10-01T00:00:00Z',
};

describe('ClientFormPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;
  let roles: Role[];

  beforeEach(() => {
    roles = ['lab-admin'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => http.verify());

  async function render(id?: string, answer: Client = stored) {
    const fixture = TestBed.createComponent(ClientFormPage);
    if (id) fixture.componentRef.setInput('id', id);
    await fixture.whenStable();
    if (id) {
      http.expectOne({ method: 'GET', url: `/api/clients/${id}` }).flush(answer);
      await fixture.whenStable();
    }
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('adds a client: the address as trimmed lines, the contact, the invoicing choice', async () => {
    const { fixture, el, loader } = await render();
    expect(textOf(el.querySelector('h1'))).toBe('Add a client');
    await (await inputLabelled(loader, 'Client name')).setValue(' Tidewater Radio ');
    await (await inputLabelled(loader, 'Postal address')).setValue(' 12 Harbour Row \n\nFalmouth TR11 2AA\n');
    await (await inputLabelled(loader, 'Contact name')).setValue('Oskar Lind');
    await (await inputLabelled(loader, 'Contact e-mail')).setValue('oskar@tidewater.example ');
    await (await loader.getHarness(MatCheckboxHarness)).check();
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/clients' });
    expect(req.request.body).toEqual({ name: 'Tidewater Radio', addressLines: ['12 Harbour Row', 'Falmouth TR11 2AA'], contactName: 'Oskar Lind', contactEmail: 'oskar@tidewater.example', invoiceLater: true });
    req.flush({ ...stored, id: 'cl-2' });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/clients']);
  });

  it('shows what is missing beside each field and sends nothing', async () => {
    const { fixture, el, loader } = await render();
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Client name')).toEqual(['Enter the client name.']);
    expect(await errorsOf(loader, 'Contact name')).toEqual(['Enter the contact\'s name.']);
    expect(await errorsOf(loader, 'Contact e-mail')).toEqual(['Enter an e-mail address such as name@maker.example.']);
    const email = await inputLabelled(loader, 'Contact e-mail');
    await email.setValue('not-an-address');
    await email.blur();
    expect(await errorsOf(loader, 'Contact e-mail')).toEqual(['Enter an e-mail address such as name@maker.example.']);
    http.expectNone('/api/clients');
  });

  it('loads a client for change and saves with PUT', async () => {
    const { fixture, el, loader } = await render('cl-1');
    expect(textOf(el.querySelector('h1'))).toBe('Change client');
    expect(await (await inputLabelled(loader, 'Postal address')).getValue()).toBe('4 Quay Road\nPortsmouth PO1 3AB');
    await (await inputLabelled(loader, 'Contact name')).setValue('Mara Quist-Holm');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/clients/cl-1' });
    expect(req.request.body).toEqual({ name: 'Halyard Marine', addressLines: ['4 Quay Road', 'Portsmouth PO1 3AB'], contactName: 'Mara Quist-Holm', contactEmail: 'mara@halyard.example', invoiceLater: false });
    req.flush(stored);
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith(['/clients']);
  });

  it('shows the server’s refusal and stays on the form', async () => {
    const { fixture, el } = await render('cl-1');
    submit(el);
    http.expectOne({ method: 'PUT', url: '/api/clients/cl-1' }).flush(...problem(409, 'Another client of your lab already has this name.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Another client of your lab already has this name.']);
    expect(navigate).not.toHaveBeenCalled();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
  });

  it('shows why a client cannot be opened', async () => {
    const fixture = TestBed.createComponent(ClientFormPage);
    fixture.componentRef.setInput('id', 'cl-404');
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('mat-progress-bar[aria-label="Working"]')).not.toBeNull();
    http.expectOne('/api/clients/cl-404').flush(...problem(404, 'No such client in this lab.'));
    await fixture.whenStable();
    expect(alerts(fixture.nativeElement)).toEqual(['No such client in this lab.']);
    expect(fixture.nativeElement.querySelector('mat-progress-bar')).toBeNull();
  });

  it('lets a lab admin invite the client’s administrator and says where the invitation went', async () => {
    const { fixture, el } = await render('cl-1');
    buttonNamed(el, 'Invite to their portal').click();
    const req = http.expectOne({ method: 'POST', url: '/api/clients/cl-1/invitations' });
    expect(req.request.body).toEqual({});
    req.flush({ email: 'mara@halyard.example', expiresAt: '2026-11-09T10:00:00Z' });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Invitation sent to mara@halyard.example. They will see their reports from your lab on their own portal.');
  });

  it('shows a refused invitation', async () => {
    const { fixture, el } = await render('cl-1');
    buttonNamed(el, 'Invite to their portal').click();
    http.expectOne('/api/clients/cl-1/invitations').flush(...problem(409, 'This client already has an organization on Sidecheck.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['This client already has an organization on Sidecheck.']);
    expect(el.querySelector('[role="status"]')).toBeNull();
  });

  it('offers no invitation to an engineer, nor for a client already on its portal', async () => {
    roles = ['engineer'];
    const engineer = await render('cl-1');
    expect(() => buttonNamed(engineer.el, 'Invite to their portal')).toThrow();
    roles = ['lab-admin'];
    const onPortal = await render('cl-1', { ...stored, clientOrganizationId: 'org-m' });
    expect(() => buttonNamed(onPortal.el, 'Invite to their portal')).toThrow();
  });
});
