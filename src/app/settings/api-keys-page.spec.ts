import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { Clipboard } from '@angular/cdk/clipboard';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ApiKeysPage } from './api-keys-page';
import type { ApiKeyRow } from './api-keys-api';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, submit, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// Invented keys (test fixtures); the sck_ prefix is the server's (server/api-keys).
const key = (n: number, extra: Partial<ApiKeyRow> = {}): ApiKeyRow => ({
  id: `k-${n}`, name: `Bench ${n} script`, prefix: `sck_ab${n}d`, createdAt: '2026-10-01T09:00:00Z', createdBy: 'u-1', lastUsedAt: null, revokedAt: null, ...extra,
});

describe('ApiKeysPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const list = () => http.expectOne((r) => r.method === 'GET' && r.url === '/api/api-keys');

  async function render(items: ApiKeyRow[]) {
    const fixture = TestBed.createComponent(ApiKeysPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading API keys"]')).not.toBeNull();
    list().flush({ items, total: items.length, page: 1, pageSize: 200 });
    await fixture.whenStable();
    return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists each key by its prefix, never its secret, with when it was last used and its state', async () => {
    const { el } = await render([key(1, { lastUsedAt: '2026-11-02T08:30:00Z' }), key(2, { revokedAt: '2026-10-20T00:00:00Z' })]);
    const rows = [...el.querySelectorAll('tr.mat-mdc-row')].map(textOf);
    expect(rows).toHaveLength(2);
    expect(rows[0]).toContain('sck_ab1d…');
    expect(rows[0]).toContain('Active');
    expect(rows[1]).toContain('Never');
    expect(rows[1]).toContain('Revoked 20 Oct 2026');
    expect(el.querySelector('button[aria-label="Revoke Bench 1 script"]')).not.toBeNull();
    expect(el.querySelector('button[aria-label="Revoke Bench 2 script"]')).toBeNull();
  });

  it('says there are no keys yet', async () => {
    const { el } = await render([]);
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('No API keys yet. Bench scripts use one to send readings without a person signing in.');
  });

  it('asks for a name before making a key', async () => {
    const { fixture, el, loader } = await render([]);
    await (await inputLabelled(loader, 'Name of the key')).setValue('   ');
    submit(el);
    await fixture.whenStable();
    // The product's own wording.
    expect(await errorsOf(loader, 'Name of the key')).toEqual(['Give the key a name.']);
    http.expectNone({ method: 'POST', url: '/api/api-keys' });
  });

  it('makes a key, shows the secret once with a copy button, and forgets it when dismissed', async () => {
    const { fixture, el, loader } = await render([]);
    const copy = jest.spyOn(TestBed.inject(Clipboard), 'copy').mockReturnValue(true);
    await (await inputLabelled(loader, 'Name of the key')).setValue(' Bench 2 analyzer script ');
    submit(el);
    const req = http.expectOne({ method: 'POST', url: '/api/api-keys' });
    expect(req.request.body).toEqual({ name: 'Bench 2 analyzer script' });
    req.flush({ ...key(3, { name: 'Bench 2 analyzer script' }), key: 'sck_ab3d_0123456789abcdef' });
    list().flush({ items: [key(3, { name: 'Bench 2 analyzer script' })], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const once = el.querySelector('section[aria-labelledby="new-key-title"]')!;
    expect(textOf(once.querySelector('code[aria-label="The new API key"]'))).toBe('sck_ab3d_0123456789abcdef');
    // The product's own wording.
    expect(textOf(once)).toContain('Copy it now: you will not see it again.');
    expect(await (await inputLabelled(loader, 'Name of the key')).getValue()).toBe('');
    expect(await errorsOf(loader, 'Name of the key')).toEqual([]);
    buttonNamed(once, 'Copy').click();
    await fixture.whenStable();
    expect(copy).toHaveBeenCalledWith('sck_ab3d_0123456789abcdef');
    expect(textOf(once.querySelector('[role="status"]'))).toContain('Copied to the clipboard.');
    buttonNamed(once, 'I have stored it safely').click();
    await fixture.whenStable();
    expect(el.textContent).not.toContain('sck_ab3d_0123456789abcdef');
    expect(el.textContent).toContain('sck_ab3d…');
  });

  it('revokes a key after the person confirms, and keeps it when they do not', async () => {
    const { fixture, el } = await render([key(1)]);
    const confirm = jest.spyOn(window, 'confirm').mockReturnValueOnce(false).mockReturnValueOnce(true);
    el.querySelector<HTMLButtonElement>('button[aria-label="Revoke Bench 1 script"]')!.click();
    http.expectNone({ method: 'DELETE' });
    el.querySelector<HTMLButtonElement>('button[aria-label="Revoke Bench 1 script"]')!.click();
    expect(confirm).toHaveBeenLastCalledWith('Revoke the key "Bench 1 script" (sck_ab1d…)? Bench scripts using it stop working at once.');
    http.expectOne({ method: 'DELETE', url: '/api/api-keys/k-1' }).flush(null);
    list().flush({ items: [key(1, { revokedAt: '2026-11-03T00:00:00Z' })], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(textOf(el.querySelector('tr.mat-mdc-row'))).toContain('Revoked 3 Nov 2026');
  });

  it('shows the server’s refusal of a new key', async () => {
    const { fixture, el, loader } = await render([]);
    await (await inputLabelled(loader, 'Name of the key')).setValue('Bench 2');
    submit(el);
    http.expectOne({ method: 'POST', url: '/api/api-keys' }).flush(...problem(403, 'Only a lab administrator can make API keys.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Only a lab administrator can make API keys.']);
    expect(el.querySelector('section[aria-labelledby="new-key-title"]')).toBeNull();
  });

  it('shows why the keys could not be listed, without claiming there are none', async () => {
    const fixture = TestBed.createComponent(ApiKeysPage);
    await fixture.whenStable();
    list().flush(...problem(403, 'Only a lab administrator can see API keys.'));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(alerts(el)).toEqual(['Only a lab administrator can see API keys.']);
    expect(el.querySelector('.sc-empty')).toBeNull();
  });
});
