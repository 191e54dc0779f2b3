import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { RuleSetsPage } from './rule-sets-page';
import type { RuleSet } from './rule-sets-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { SAMPLE_RULE_SETS } from '../../../shared/rules/sample-rule-sets';
import { alerts, buttonNamed, problem, settle, textOf } from '../testing/page-testing';

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// The shipped maritime sample (shared/rules/sample-rule-sets.ts) and an invented lab copy of it.
const maritime = SAMPLE_RULE_SETS[0];
const sample: RuleSet = { id: 'rs-sample', key: maritime.key, version: 1, name: maritime.name, service: 'maritime', isSample: true, builtIn: true, body: maritime.body, createdAt: '2026-01-01T00:00:00Z' };
const own: RuleSet = { ...sample, id: 'rs-own', key: 'kestrel-maritime', version: 3, name: 'Kestrel maritime J3E', isSample: false, builtIn: false, body: { ...maritime.body, references: maritime.body.references.slice(0, 1) }, createdAt: '2026-10-02T12:00:00Z' };

describe('RuleSetsPage', () => {
  let http: HttpTestingController;
  let roles: Role[];

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
    // jsdom lays nothing out, so the CDK finds no focusable element for the dialog's first field; a browser does.
    const warn = console.warn;
    jest.spyOn(console, 'warn').mockImplementation((...args: unknown[]) => (String(args[0]).includes('cdkFocusInitial') ? undefined : warn(...args)));
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  async function render(items: RuleSet[]) {
    const fixture = TestBed.createComponent(RuleSetsPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading rule sets"]')).not.toBeNull();
    const req = http.expectOne((r) => r.method === 'GET' && r.url === '/api/rule-sets');
    // The latest version of each, by name, in one page.
    expect(req.request.params.get('latest')).toBe('true');
    expect(req.request.params.get('sort')).toBe('name');
    expect(req.request.params.get('pageSize')).toBe('200');
    req.flush({ items, total: items.length, page: 1, pageSize: 200 });
    await fixture.whenStable();
    return { fixture, el };
  }

  it('lists the lab’s own rule sets apart from the samples, each sample marked for verification', async () => {
    const { el } = await render([own, sample]);
    const ownCards = [...el.querySelectorAll('section[aria-labelledby="own-title"] li')].map(textOf);
    const sampleCards = [...el.querySelectorAll('section[aria-labelledby="samples-title"] li')].map(textOf);
    expect(ownCards).toHaveLength(1);
    expect(ownCards[0]).toContain('Kestrel maritime J3E');
    expect(ownCards[0]).toContain('version 3');
    expect(ownCards[0]).toMatch(/1 source document(?!s)/);
    expect(sampleCards).toHaveLength(1);
    // The product's own wording.
    expect(sampleCards[0]).toContain('Sample: verify against the current edition');
    // The first three references with their editions (shared/rules/sample-rule-sets.ts), then an ellipsis for the fourth.
    expect(sampleCards[0]).toContain('4 source documents: 47 CFR 80.207 (c) (2024); 47 CFR 80.209 (2024); 47 CFR 80.211 (a) (2024); …');
    expect(el.querySelector('a[href="/rule-sets/rs-own"]')).not.toBeNull();
  });

  it('invites the lab to copy a sample when it has none of its own', async () => {
    const { el } = await render([sample]);
    // The product's own wording.
    expect(textOf(el.querySelector('.sc-empty'))).toBe('None yet. Copy a sample below, verify its limits against the current edition of each source, then use it in your plans.');
  });

  it('offers no copying to a reviewer', async () => {
    roles = ['reviewer'];
    const { el } = await render([own, sample]);
    expect(() => buttonNamed(el, 'Copy')).toThrow();
    expect(textOf(el.querySelector('section[aria-labelledby="own-title"] a[mat-button]'))).toBe('Open');
  });

  it('copies a sample under the name given in the dialog and opens the copy', async () => {
    const { fixture, el } = await render([sample]);
    const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    buttonNamed(el, 'Copy').click();
    await fixture.whenStable();
    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Copy to your lab');
    expect(await dialog.getContentText()).toContain('verify every limit against the current edition');
    const name = await dialog.getHarness(MatInputHarness);
    expect(await name.getValue()).toBe(`${maritime.name} (our copy)`);
    await name.setValue('  Kestrel maritime  ');
    document.querySelector<HTMLFormElement>('mat-dialog-container form')!.dispatchEvent(new Event('submit'));
    await settle(fixture);
    const req = http.expectOne({ method: 'POST', url: '/api/rule-sets/rs-sample/copy' });
    expect(req.request.body).toEqual({ name: 'Kestrel maritime' });
    req.flush({ ...own, id: 'rs-copy', version: 1, name: 'Kestrel maritime' });
    await settle(fixture);
    // The product's own wording.
    expect(navigate).toHaveBeenCalledWith(['/rule-sets', 'rs-copy'], { state: { notice: 'Copied as “Kestrel maritime”, version 1. Edit it below.' } });
  });

  it('shows why a copy was refused', async () => {
    const { fixture, el } = await render([sample]);
    buttonNamed(el, 'Copy').click();
    await fixture.whenStable();
    document.querySelector<HTMLFormElement>('mat-dialog-container form')!.dispatchEvent(new Event('submit'));
    await settle(fixture);
    http.expectOne('/api/rule-sets/rs-sample/copy').flush(...problem(409, 'Your lab already has a rule set with this name.'));
    await settle(fixture);
    expect(alerts(el)[0]).toContain('Your lab already has a rule set with this name.');
  });

  it('shows the server’s problem and tries again', async () => {
    const fixture = TestBed.createComponent(RuleSetsPage);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    http.expectOne((r) => r.url === '/api/rule-sets').flush(...problem(500, 'The rule sets could not be read.'));
    await fixture.whenStable();
    expect(alerts(el)[0]).toContain('The rule sets could not be read.');
    buttonNamed(el, 'Try again').click();
    http.expectOne((r) => r.url === '/api/rule-sets').flush({ items: [sample], total: 1, page: 1, pageSize: 200 });
    await fixture.whenStable();
    expect(alerts(el)).toEqual([]);
  });
});
