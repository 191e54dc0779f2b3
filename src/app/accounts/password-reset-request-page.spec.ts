import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { PasswordResetRequestPage } from './password-reset-request-page';
import { alerts, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('PasswordResetRequestPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(PasswordResetRequestPage);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('sends the trimmed address and shows the server’s own answer in place of the form', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'E-mail')).setValue(' ines@kestrel.example ');
    submit(el);
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar[aria-label="Sending"]')).not.toBeNull();
    const req = http.expectOne({ method: 'POST', url: '/api/auth/password-reset/request' });
    expect(req.request.body).toEqual({ email: 'ines@kestrel.example' });
    // The server words the answer the same whether or not the account exists.
    req.flush({ detail: 'If an account uses this address, a link to choose a new password is on its way.' });
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="status"]'))).toBe('If an account uses this address, a link to choose a new password is on its way.');
    expect(el.querySelector('input')).toBeNull();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
  });

  it('asks for a well-formed address before sending', async () => {
    const { fixture, el, loader } = await render();
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'E-mail')).toEqual(['Enter an e-mail address such as name@lab.example.']);
    await (await inputLabelled(loader, 'E-mail')).setValue('ines-at-kestrel');
    expect(await errorsOf(loader, 'E-mail')).toEqual(['Enter an e-mail address such as name@lab.example.']);
    http.expectNone('/api/auth/password-reset/request');
  });

  it('shows the server’s refusal and keeps the form', async () => {
    const { fixture, el, loader } = await render();
    await (await inputLabelled(loader, 'E-mail')).setValue('ines@kestrel.example');
    submit(el);
    http.expectOne('/api/auth/password-reset/request').flush(...problem(429, 'Too many reset requests from your address; try again in an hour.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Too many reset requests from your address; try again in an hour.']);
    expect(el.querySelector('input')).not.toBeNull();
    expect(el.querySelector<HTMLButtonElement>('button[type="submit"]')!.disabled).toBe(false);
  });
});
