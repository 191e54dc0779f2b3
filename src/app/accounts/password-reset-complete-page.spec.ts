import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { PasswordResetCompletePage } from './password-reset-complete-page';
import { alerts, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('PasswordResetCompletePage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(PasswordResetCompletePage);
    fixture.componentRef.setInput('token', 'reset-token-1');
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('sends the link’s token with the new password and says every session was signed out', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'New password')).setValue('harbour lights 2027');
    await (await inputLabelled(loader, 'Repeat the new password')).setValue('harbour lights 2027');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Saving the new password"]')).not.toBeNull();
    const req = http.expectOne({ method: 'POST', url: '/api/auth/password-reset/complete' });
    expect(req.request.body).toEqual({ token: 'reset-token-1', password: 'harbour lights 2027' });
    req.flush(null, { status: 204, statusText: 'No Content' });
    await fixture.whenStable();
    // The product's own wording.
    expect(textOf(el.querySelector('[role="status"]'))).toBe('Your password has been changed and every session of your account has been signed out. Sign in with the new password.');
    expect(el.querySelector('input')).toBeNull();
    expect(el.querySelector('a[href="/sign-in"]')).not.toBeNull();
  });

  it('says when the two passwords differ, also after the first is changed', async () => {
    const { fixture, el, loader } = await render();
    const first = await inputLabelled(loader, 'New password');
    const repeat = await inputLabelled(loader, 'Repeat the new password');
    await first.setValue('harbour lights 2027');
    await repeat.setValue('harbour lights 2027');
    await first.setValue('harbour lights 2028');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Repeat the new password')).toEqual(['The two passwords differ.']);
    expect(await errorsOf(loader, 'New password')).toEqual([]);
    http.expectNone('/api/auth/password-reset/complete');
  });

  it('explains the password rule when the new one breaks it', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'New password')).setValue('123456789012');
    submit(el);
    await fixture.whenStable();
    // The rule of server/auth/password.ts; the product's own wording.
    expect(await errorsOf(loader, 'New password')).toEqual(['Use letters and at least one digit.']);
    http.expectNone('/api/auth/password-reset/complete');
  });

  it('shows why a used or expired link was refused, with a way to ask for a new one', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'New password')).setValue('harbour lights 2027');
    await (await inputLabelled(loader, 'Repeat the new password')).setValue('harbour lights 2027');
    submit(el);
    // DEVELOPERS.md: reset links last 1 hour and are single-use (410).
    http.expectOne('/api/auth/password-reset/complete').flush(...problem(410, 'This link has expired: reset links work for one hour. Ask for a new one.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['This link has expired: reset links work for one hour. Ask for a new one.']);
    expect(el.querySelector('a[href="/password-reset"]')).not.toBeNull();
    expect(el.querySelector('[role="status"]')).toBeNull();
  });
});
