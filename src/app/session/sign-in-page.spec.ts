import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ActivatedRoute, Router, convertToParamMap, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { SignInPage } from './sign-in-page';
import { SessionStore } from './session-store';
import { alerts, problem, settle, submit } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

const user = { userId: 'u-1', email: 'ines@kestrel.example', displayName: 'Ines Okafor', memberships: [{ organizationId: 'org-1', organizationName: 'Kestrel Bay Radio Test Laboratory', kind: 'lab', roles: ['engineer'] }] };

describe('SignInPage', () => {
  let http: HttpTestingController;
  let next: string | null = null;

  beforeEach(() => {
    next = null;
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    const route = TestBed.inject(ActivatedRoute);
    Object.defineProperty(route, 'snapshot', { get: () => ({ queryParamMap: convertToParamMap(next ? { next } : {}) }) });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(SignInPage);
    await fixture.whenStable();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const email = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="email"]' }));
    const password = await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="password"]' }));
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    return { fixture, el: fixture.nativeElement as HTMLElement, loader, email, password, navigate };
  }

  it('labels both fields for screen readers', async () => {
    const { loader } = await render();
    const fields = await loader.getAllHarnesses(MatFormFieldHarness);
    expect(await Promise.all(fields.map((f) => f.getLabel()))).toEqual(['E-mail', 'Password']);
  });

  it('shows what is missing and sends nothing when the form is empty or the address is malformed', async () => {
    const { fixture, el, loader, email } = await render();
    submit(el);
    await fixture.whenStable();
    const [emailField, passwordField] = await loader.getAllHarnesses(MatFormFieldHarness);
    // The product's own wording.
    expect(await emailField.getTextErrors()).toEqual(['Enter your e-mail address.']);
    expect(await passwordField.getTextErrors()).toEqual(['Enter your password.']);
    await email.setValue('ines-at-kestrel');
    await email.blur();
    expect(await emailField.getTextErrors()).toEqual(['Enter an e-mail address such as name@lab.example.']);
    http.expectNone('/api/auth/sign-in');
  });

  it('posts the trimmed address and the password, then opens the page asked for', async () => {
    next = '/devices';
    const { fixture, el, email, password, navigate } = await render();
    await email.setValue('  ines@kestrel.example ');
    await password.setValue('long enough secret');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Signing in"]')).not.toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(true);
    const req = http.expectOne({ method: 'POST', url: '/api/auth/sign-in' });
    expect(req.request.body).toEqual({ email: 'ines@kestrel.example', password: 'long enough secret' });
    expect(req.request.withCredentials).toBe(true);
    req.flush({ accessToken: 'token', expiresIn: 600, user });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith('/devices');
    expect(TestBed.inject(SessionStore).user()?.displayName).toBe('Ines Okafor');
    expect(el.querySelector('mat-progress-bar')).toBeNull();
  });

  it('never follows a next address that leaves the site', async () => {
    next = '//elsewhere.example/phish';
    const { fixture, el, email, password, navigate } = await render();
    await email.setValue('ines@kestrel.example');
    await password.setValue('long enough secret');
    submit(el);
    http.expectOne('/api/auth/sign-in').flush({ accessToken: 'token', expiresIn: 600, user });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith('/');
  });

  it('shows the server’s refusal as a sentence and keeps the person on the page', async () => {
    const { fixture, el, email, password, navigate } = await render();
    await email.setValue('ines@kestrel.example');
    await password.setValue('wrong');
    submit(el);
    http.expectOne('/api/auth/sign-in').flush(...problem(401, 'The e-mail address or the password is not right.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['The e-mail address or the password is not right.']);
    expect(navigate).not.toHaveBeenCalled();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
  });

  it('says the service cannot be reached when the network fails', async () => {
    const { fixture, el, email, password } = await render();
    await email.setValue('ines@kestrel.example');
    await password.setValue('secret');
    submit(el);
    http.expectOne('/api/auth/sign-in').error(new ProgressEvent('error'));
    await fixture.whenStable();
    // The product's own wording (session/problem-message.ts).
    expect(alerts(el)).toEqual(['Sidecheck cannot be reached. Check your connection and try again.']);
  });
});
