import { webcrypto } from 'node:crypto';
import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { VerifyPage } from './verify-page';
import type { VerifiedReport } from './verify-api';
import { problem, settle, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// FIPS 180-2 appendix B.1: SHA-256("abc").
const SHA256_OF_ABC = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad';

// An invented report (test fixture).
const report = (extra: Partial<VerifiedReport> = {}): VerifiedReport => ({
  reportNumber: 'KBRTL-2026-0007', revision: 1, lab: 'Kestrel Bay Radio Test Laboratory', client: 'Halyard Marine', device: 'Halyard HX-90', serialNumber: 'SN-7',
  receivedOn: '2026-10-28', testedFrom: '2026-10-30', testedTo: '2026-10-31', issuedAt: '2026-11-02T10:00:00Z', sha256: SHA256_OF_ABC,
  status: 'current', reason: null, supersededBy: null, ...extra,
});

describe('VerifyPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    // jsdom has no Web Crypto digest: lend it Node's (the same W3C Web Crypto API a browser has); the
    // bytes are copied into this realm's Uint8Array because Node refuses jsdom's ArrayBuffer.
    const subtle = { digest: (algorithm: string, data: ArrayBuffer) => webcrypto.subtle.digest(algorithm, new Uint8Array(data)) };
    Object.defineProperty(globalThis.crypto, 'subtle', { value: subtle, configurable: true });
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function render(token = 'tok-7') {
    const fixture = TestBed.createComponent(VerifyPage);
    fixture.componentRef.setInput('token', token);
    await fixture.whenStable();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  async function pick(fixture: Awaited<ReturnType<typeof render>>['fixture'], el: HTMLElement, file: File) {
    const input = el.querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    for (let i = 0; i < 10 && !textOf(el.querySelector('.check')).includes(file.name); i++) await settle(fixture);
  }

  it('looks the token up and says the report is authentic and current, with what it covers', async () => {
    const { fixture, el } = await render('a/b tok');
    expect(el.querySelector('mat-progress-bar[aria-label="Looking up the report"]')).not.toBeNull();
    http.expectOne({ method: 'GET', url: '/api/verify/a%2Fb%20tok' }).flush(report());
    await fixture.whenStable();
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    // The product's own wording.
    expect(textOf(el.querySelector('.status'))).toContain('Authentic and current. This report was issued by Kestrel Bay Radio Test Laboratory and has not been withdrawn or replaced.');
    expect(textOf(el.querySelector('h1'))).toBe('KBRTL-2026-0007 revision 1');
    expect(textOf(el.querySelector('dl'))).toContain('Halyard HX-90, s/n SN-7');
    expect(textOf(el.querySelector('dl'))).toContain('2 November 2026, 10:00 UTC');
    expect(textOf(el.querySelector('.hash'))).toBe(SHA256_OF_ABC);
  });

  it('says a withdrawn report is withdrawn, with the reason', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(report({ status: 'withdrawn', reason: 'The device tested was not the one registered.' }));
    await fixture.whenStable();
    expect(textOf(el.querySelector('.status'))).toContain('Withdrawn. Kestrel Bay Radio Test Laboratory withdrew this report. Reason: The device tested was not the one registered.');
  });

  it('points from a superseded report to the one that replaced it', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(report({ status: 'superseded', reason: 'Corrected RBW', supersededBy: { reportNumber: 'KBRTL-2026-0007', revision: 2, verifyPath: '/verify/tok-8' } }));
    await fixture.whenStable();
    expect(textOf(el.querySelector('.status'))).toContain('Superseded. This report was replaced by KBRTL-2026-0007 (rev. 2). Reason: Corrected RBW');
    expect(el.querySelector('.status a')!.getAttribute('href')).toBe('/verify/tok-8');
  });

  it('says so in words when no report has this link', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(...problem(404, 'Not found'));
    await fixture.whenStable();
    expect(textOf(el.querySelector('h1'))).toBe('Report not found');
    // The product's own wording.
    expect(textOf(el.querySelector('[role="alert"]'))).toBe('No report is registered under this verification link. It may have been mistyped.');
    expect(el.querySelector('mat-progress-bar')).toBeNull();
  });

  it('shows the server’s message for other failures', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(...problem(429, 'Too many look-ups from your address; try again in a minute.'));
    await fixture.whenStable();
    expect(textOf(el.querySelector('[role="alert"]'))).toBe('Too many look-ups from your address; try again in a minute.');
  });

  it('checks a chosen file against the issued SHA-256 in the browser, uploading nothing', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(report());
    await fixture.whenStable();
    await pick(fixture, el, new File(['abc'], 'KBRTL-2026-0007.pdf', { type: 'application/pdf' }));
    // The product's own wording.
    expect(textOf(el.querySelector('.check'))).toBe('Match. KBRTL-2026-0007.pdf is exactly the file issued as KBRTL-2026-0007.');
    await pick(fixture, el, new File(['abd'], 'changed.pdf', { type: 'application/pdf' }));
    const text = textOf(el.querySelector('.check'));
    expect(text).toMatch(/^No match\. changed\.pdf is not the issued file \(its SHA-256 is [0-9a-f]{64}\)\. It may have been changed\.$/);
    expect(text).not.toContain(SHA256_OF_ABC);
    http.expectNone(() => true);
  });

  it('says when the browser cannot check the file, instead of waiting forever', async () => {
    const { fixture, el } = await render();
    http.expectOne('/api/verify/tok-7').flush(report());
    await fixture.whenStable();
    Object.defineProperty(globalThis.crypto, 'subtle', { value: undefined, configurable: true });
    await pick(fixture, el, new File(['abc'], 'KBRTL-2026-0007.pdf', { type: 'application/pdf' }));
    // The product's own wording.
    expect(textOf(el.querySelector('.check[role="alert"]'))).toBe('KBRTL-2026-0007.pdf could not be checked in this browser. Compare its SHA-256 with the one above using another tool.');
    expect(el.querySelector('mat-progress-bar[aria-label="Checking the file"]')).toBeNull();
  });
});
