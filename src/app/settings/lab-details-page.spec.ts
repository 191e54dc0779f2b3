import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { LabDetailsPage } from './lab-details-page';
import type { LabDetails, MailSettings } from './lab-details-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// An invented lab (test fixture).
const lab: LabDetails = { name: 'Kestrel Bay Radio Test Laboratory', code: 'KBRTL', addressLines: ['Unit 4, Quay Road', 'Portsmouth PO1 3AB'], email: 'lab@kestrel.example', phone: null, accreditation: 'Accreditation body 0000' };

describe('LabDetailsPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  /** Signs in an invented person with `roles` in the lab, renders the page and answers its e-mail settings request with `mail` (left open when null). */
  async function render(options: { roles?: Role[]; mail?: MailSettings | null } = {}) {
    const roles = options.roles ?? ['lab-admin'];
    TestBed.inject(SessionStore).user.set({ userId: 'u-1', email: 'ada@kestrel.example', displayName: 'Ada Lovell', memberships: [{ organizationId: 'org-1', kind: 'lab', roles }] });
    const fixture = TestBed.createComponent(LabDetailsPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    const mail = options.mail === undefined ? { attachPdfToEmail: false } : options.mail;
    if (roles.includes('lab-admin') && mail) {
      http.expectOne({ method: 'GET', url: '/api/organization/mail-settings' }).flush(mail);
      await fixture.whenStable();
    }
    const loader = TestbedHarnessEnvironment.loader(fixture);
    return {
      fixture, el, loader,
      save: () => el.querySelector<HTMLButtonElement>('form[aria-labelledby="lab-title"] button[type="submit"]')!,
      attach: () => loader.getHarness(MatCheckboxHarness.with({ label: 'Attach the signed PDF to the report-issued e-mail' })),
      saveMail: () => buttonNamed(el, 'Save e-mail settings'),
      mailForm: () => el.querySelector<HTMLFormElement>('form[aria-labelledby="mail-title"]')!,
    };
  }

  it('loads the details into the form and names the fixed lab code', async () => {
    const { fixture, el, loader, save } = await render();
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the lab details"]')).not.toBeNull();
    expect(save().disabled).toBe(true);
    http.expectOne({ method: 'GET', url: '/api/organization' }).flush(lab);
    await fixture.whenStable();
    expect(await (await inputLabelled(loader, 'Lab name')).getValue()).toBe('Kestrel Bay Radio Test Laboratory');
    expect(await (await inputLabelled(loader, 'Postal address')).getValue()).toBe('Unit 4, Quay Road\nPortsmouth PO1 3AB');
    expect(await (await inputLabelled(loader, 'Telephone')).getValue()).toBe('');
    // The product's own wording.
    expect(textOf(el.querySelector('p.sc-muted'))).toContain('Report numbers start with the lab code KBRTL, which stays fixed.');
    expect(save().disabled).toBe(false);
  });

  it('saves trimmed details, empty optional lines as null, and says issued reports keep theirs', async () => {
    const { fixture, el, loader } = await render();
    http.expectOne('/api/organization').flush(lab);
    await fixture.whenStable();
    await (await inputLabelled(loader, 'Postal address')).setValue(' Unit 4, Quay Road \n\n Portsmouth PO1 3AB\nUnited Kingdom ');
    await (await inputLabelled(loader, 'Contact e-mail')).setValue('  ');
    await (await inputLabelled(loader, 'Telephone')).setValue(' +44 23 0000 0000 ');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/organization' });
    expect(req.request.body).toEqual({
      name: 'Kestrel Bay Radio Test Laboratory', addressLines: ['Unit 4, Quay Road', 'Portsmouth PO1 3AB', 'United Kingdom'],
      email: null, phone: '+44 23 0000 0000', accreditation: 'Accreditation body 0000',
    });
    req.flush({ ...lab, addressLines: req.request.body.addressLines });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Saved. Reports issued from now on carry these details; reports already issued keep theirs.');
  });

  it('asks for the name and address ISO/IEC 17025 requires, and a well-formed e-mail', async () => {
    const { fixture, el, loader } = await render();
    http.expectOne('/api/organization').flush(lab);
    await fixture.whenStable();
    await (await inputLabelled(loader, 'Lab name')).setValue(' ');
    await (await inputLabelled(loader, 'Postal address')).setValue('');
    await (await inputLabelled(loader, 'Contact e-mail')).setValue('lab-at-kestrel');
    submit(el);
    await fixture.whenStable();
    // ISO/IEC 17025:2017 7.8.2.1 b (the lab's name and address); messages are the product's own wording.
    expect(await errorsOf(loader, 'Lab name')).toEqual(['Enter the lab name.']);
    expect(await errorsOf(loader, 'Postal address')).toEqual(["Enter the lab's address."]);
    expect(await errorsOf(loader, 'Contact e-mail')).toEqual(['Enter an e-mail address such as lab@example.org.']);
    http.expectNone({ method: 'PUT' });
  });

  it('shows the server’s refusal of a save', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/organization').flush(lab);
    await fixture.whenStable();
    submit(el);
    http.expectOne({ method: 'PUT', url: '/api/organization' }).flush(...problem(422, 'An address has at most six lines.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('An address has at most six lines.');
    expect(el.querySelector('[role="status"]')).toBeNull();
  });

  it('shows a field error of the server under the field that looked valid, and the rest in the banner', async () => {
    const { fixture, el, loader } = await render();
    http.expectOne('/api/organization').flush(lab);
    await fixture.whenStable();
    submit(el);
    // Pointers as ajv reports them through server/http/problem.ts (problem+json, RFC 9457).
    http.expectOne({ method: 'PUT', url: '/api/organization' }).flush(
      ...problem(422, 'The organization has 2 problems: /name must NOT have more than 200 characters.', [
        { pointer: '/name', message: 'must NOT have more than 200 characters' },
        { pointer: '/addressLines/1', message: 'must NOT have more than 200 characters' },
      ]),
    );
    await fixture.whenStable();
    expect(await errorsOf(loader, 'Lab name')).toEqual(['Must NOT have more than 200 characters']);
    expect(await errorsOf(loader, 'Postal address')).toEqual(['Must NOT have more than 200 characters']);
    // The product's own wording.
    expect(alerts(el)).toEqual(['Correct the 2 fields marked below and try again.']);
    expect(el.querySelector('[role="status"]')).toBeNull();
  });

  it('offers no saving over details it could not read, and reads them again on request', async () => {
    const { fixture, el, loader, save } = await render();
    http.expectOne('/api/organization').flush(...problem(503, 'The database is restarting; try again in a minute.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('The database is restarting; try again in a minute.');
    expect(save().disabled).toBe(true);
    expect(await (await inputLabelled(loader, 'Lab name')).isDisabled()).toBe(true);
    buttonNamed(el, 'Try again').click();
    http.expectOne('/api/organization').flush(lab);
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
    expect(save().disabled).toBe(false);
  });
  describe('e-mail to clients', () => {
    it('loads whether the report-issued e-mail carries the signed PDF', async () => {
      const { fixture, el, attach, saveMail } = await render({ mail: null });
      http.expectOne('/api/organization').flush(lab);
      await fixture.whenStable();
      expect(el.querySelector('mat-progress-bar[aria-label="Loading the e-mail settings"]')).not.toBeNull();
      expect(await (await attach()).isDisabled()).toBe(true);
      expect(saveMail().disabled).toBe(true);
      http.expectOne({ method: 'GET', url: '/api/organization/mail-settings' }).flush({ attachPdfToEmail: true });
      await fixture.whenStable();
      expect(el.querySelector('mat-progress-bar[aria-label="Loading the e-mail settings"]')).toBeNull();
      expect(await (await attach()).isChecked()).toBe(true);
      expect(await (await attach()).isDisabled()).toBe(false);
      expect(saveMail().disabled).toBe(false);
    });

    it('saves the choice and confirms what report e-mails will carry', async () => {
      const { fixture, el, attach, saveMail } = await render();
      http.expectOne('/api/organization').flush(lab);
      await fixture.whenStable();
      await (await attach()).check();
      submit(el, 'form[aria-labelledby="mail-title"]');
      await fixture.whenStable();
      expect(el.querySelector('mat-progress-bar[aria-label="Saving the e-mail settings"]')).not.toBeNull();
      expect(saveMail().disabled).toBe(true);
      const req = http.expectOne({ method: 'PUT', url: '/api/organization/mail-settings' });
      expect(req.request.body).toEqual({ attachPdfToEmail: true });
      req.flush({ attachPdfToEmail: true });
      await fixture.whenStable();
      // The product's own wording.
      expect(textOf(el.querySelector('form[aria-labelledby="mail-title"] [role="status"]'))).toBe('Saved. Report e-mails sent from now on carry the signed PDF.');
      await (await attach()).uncheck();
      submit(el, 'form[aria-labelledby="mail-title"]');
      const off = http.expectOne({ method: 'PUT', url: '/api/organization/mail-settings' });
      expect(off.request.body).toEqual({ attachPdfToEmail: false });
      off.flush({ attachPdfToEmail: false });
      await fixture.whenStable();
      expect(textOf(el.querySelector('form[aria-labelledby="mail-title"] [role="status"]'))).toBe('Saved. Report e-mails sent from now on ask the client to sign in and download the signed PDF.');
      // Saving the e-mail choice sends nothing about the details printed on reports.
      http.expectNone({ method: 'PUT', url: '/api/organization' });
    });

    it('says why a save was refused and keeps the choice on screen', async () => {
      const { fixture, el, attach, saveMail } = await render();
      http.expectOne('/api/organization').flush(lab);
      await fixture.whenStable();
      await (await attach()).check();
      submit(el, 'form[aria-labelledby="mail-title"]');
      http.expectOne({ method: 'PUT', url: '/api/organization/mail-settings' }).flush(...problem(403, 'Only a lab administrator may change the e-mail settings.'));
      await fixture.whenStable();
      expect(alerts(el)).toEqual(['Only a lab administrator may change the e-mail settings.']);
      expect(el.querySelector('[role="status"]')).toBeNull();
      expect(await (await attach()).isChecked()).toBe(true);
      expect(saveMail().disabled).toBe(false);
    });

    it('offers no saving over a choice it could not read, and reads it again on request', async () => {
      const { fixture, el, attach, saveMail, mailForm } = await render({ mail: null });
      http.expectOne('/api/organization').flush(lab);
      http.expectOne('/api/organization/mail-settings').flush(...problem(503, 'The database is restarting; try again in a minute.'));
      await fixture.whenStable();
      expect(alerts(el)).toEqual(['The database is restarting; try again in a minute. Try again']);
      expect(await (await attach()).isDisabled()).toBe(true);
      expect(saveMail().disabled).toBe(true);
      submit(el, 'form[aria-labelledby="mail-title"]');
      http.expectNone({ method: 'PUT', url: '/api/organization/mail-settings' });
      buttonNamed(mailForm(), 'Try again').click();
      http.expectOne('/api/organization/mail-settings').flush({ attachPdfToEmail: false });
      await fixture.whenStable();
      expect(alerts(el)).toEqual([]);
      expect(await (await attach()).isChecked()).toBe(false);
      expect(saveMail().disabled).toBe(false);
    });

    it('is disabled for anyone but a lab administrator, who alone may change it, and asks the server nothing', async () => {
      // server/organizations/routes.ts: GET and PUT /organization/mail-settings admit 'lab-admin' only.
      const { fixture, el, attach, saveMail } = await render({ roles: ['engineer', 'reviewer'] });
      http.expectOne('/api/organization').flush(lab);
      await fixture.whenStable();
      http.expectNone('/api/organization/mail-settings');
      expect(await (await attach()).isDisabled()).toBe(true);
      expect(saveMail().disabled).toBe(true);
      // The product's own wording.
      expect(textOf(el.querySelector('#mail-help'))).toContain('Only a lab administrator can see or change this setting.');
    });
  });
});
