import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { SignUpPage } from './sign-up-page';
import { SessionStore } from '../session/session-store';
import { alerts, errorsOf, inputLabelled, problem, settle, submit } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// An invented lab and person (test fixtures).
const user = { userId: 'u-1', email: 'ines@kestrel.example', displayName: 'Ines Okafor', memberships: [{ organizationId: 'org-new', organizationName: 'Kestrel Bay', kind: 'lab', roles: ['lab-admin'] }] };

describe('SignUpPage', () => {
  let http: HttpTestingController;
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(SignUpPage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  async function fill(loader: Awaited<ReturnType<typeof render>>['loader'], code = '') {
    await (await inputLabelled(loader, 'Lab name')).setValue(' Kestrel Bay Radio Test Laboratory ');
    await (await inputLabelled(loader, 'Lab code (optional)')).setValue(code);
    await (await inputLabelled(loader, 'Postal address')).setValue('Unit 4, Quay Road\n\nPortsmouth PO1 3AB');
    await (await inputLabelled(loader, 'Your name')).setValue(' Ines Okafor ');
    await (await inputLabelled(loader, 'E-mail')).setValue('ines@kestrel.example');
    await (await inputLabelled(loader, 'Password')).setValue('harbour lights 2026');
  }

  it('creates the lab, loads the new session and opens the bench board', async () => {
    const { fixture, el, loader } = await render();
    await fill(loader, 'KBRTL');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Creating your lab"]')).not.toBeNull();
    const req = http.expectOne({ method: 'POST', url: '/api/auth/sign-up' });
    expect(req.request.withCredentials).toBe(true);
    expect(req.request.body).toEqual({ labName: 'Kestrel Bay Radio Test Laboratory', labCode: 'KBRTL', address: ['Unit 4, Quay Road', 'Portsmouth PO1 3AB'], name: 'Ines Okafor', email: 'ines@kestrel.example', password: 'harbour lights 2026' });
    req.flush({ organizationId: 'org-new' });
    await settle(fixture);
    // The answer set the refresh cookie: the session is read from there.
    http.expectOne({ method: 'POST', url: '/api/auth/refresh' }).flush({ accessToken: 't', expiresIn: 600, user });
    await settle(fixture);
    expect(TestBed.inject(SessionStore).activeOrganizationId()).toBe('org-new');
    expect(TestBed.inject(SessionStore).user()?.displayName).toBe('Ines Okafor');
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('leaves out a blank lab code so the server makes one from the name', async () => {
    const { fixture, el, loader } = await render();
    await fill(loader);
    submit(el);
    const req = http.expectOne('/api/auth/sign-up');
    expect(req.request.body.labCode).toBeUndefined();
    req.flush(...problem(409, 'The lab code KBRTL is taken: choose another.'));
    await settle(fixture);
  });

  it('shows what is missing, a malformed code and a weak password beside their fields', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'Lab code (optional)')).setValue('K-1');
    await (await inputLabelled(loader, 'Password')).setValue('short1');
    submit(el);
    await fixture.whenStable();
    // The product's own wording; the password rule is the server's (server/auth/password.ts: at least 12 characters).
    expect(await errorsOf(loader, 'Lab name')).toEqual(["Enter the lab's name as it should appear on reports."]);
    expect(await errorsOf(loader, 'Lab code (optional)')).toEqual(['Use 2 to 8 letters or digits.']);
    expect(await errorsOf(loader, 'Postal address')).toEqual(["Enter the lab's address."]);
    expect(await errorsOf(loader, 'Your name')).toEqual(['Enter your name.']);
    expect(await errorsOf(loader, 'E-mail')).toEqual(['Enter an e-mail address such as name@lab.example.']);
    expect(await errorsOf(loader, 'Password')).toEqual(['Use at least 12 characters.']);
    await (await inputLabelled(loader, 'Password')).setValue('only letters here');
    expect(await errorsOf(loader, 'Password')).toEqual(['Use letters and at least one digit.']);
    http.expectNone('/api/auth/sign-up');
  });

  it('shows the server’s refusal and stays on the page', async () => {
    const { fixture, el, loader } = await render();
    await fill(loader);
    submit(el);
    http.expectOne('/api/auth/sign-up').flush(...problem(409, 'An account with this e-mail address exists: sign in, or reset the password.'));
    await settle(fixture);
    expect(alerts(el)).toEqual(['An account with this e-mail address exists: sign in, or reset the password.']);
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
    expect(navigate).not.toHaveBeenCalled();
    expect(el.querySelector('a[href="/sign-in"]')).not.toBeNull();
  });
});
