import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Router, provideRouter } from '@angular/router';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { RuleSetEditorPage } from './rule-set-editor-page';
import type { RuleSet } from './rule-sets-api';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';
import { SAMPLE_RULE_SETS } from '../../../shared/rules/sample-rule-sets';
import { alerts, buttonNamed, errorsOf, inputLabelled, problem, settle, submit, textOf } from '../testing/page-testing';

// jsdom has no canvas: the mask plot's uPlot is a stand-in (the browser suite draws the real one).
jest.mock('uplot', () => ({
  __esModule: true,
  default: jest.fn(() => ({ width: 560, batch: (fn: () => void) => fn(), setData() {}, setSize() {}, destroy() {} })),
}));

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

// The shipped maritime sample (shared/rules/sample-rule-sets.ts) and an invented lab copy of it.
const maritime = SAMPLE_RULE_SETS[0];
const sample: RuleSet = { id: 'rs-sample', key: maritime.key, version: 1, name: maritime.name, service: 'maritime', isSample: true, builtIn: true, body: maritime.body, createdAt: '2026-01-01T00:00:00Z' };
const own = (version: number): RuleSet => ({ ...sample, id: `rs-own-${version}`, key: 'kestrel-maritime', version, name: 'Kestrel maritime J3E', isSample: false, builtIn: false, createdAt: '2026-10-02T12:00:00Z' });

describe('RuleSetEditorPage', () => {
  let http: HttpTestingController;
  let roles: Role[];
  let navigate: jest.SpyInstance;

  beforeEach(() => {
    roles = ['engineer'];
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
    navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    jest.spyOn(TestBed.inject(SessionStore), 'hasRole').mockImplementation((...asked) => asked.some((r) => roles.includes(r)));
  });
  afterEach(() => {
    http.verify();
    document.querySelectorAll('.cdk-overlay-container').forEach((c) => (c.innerHTML = ''));
  });

  async function render(shown: RuleSet, versions?: RuleSet[]) {
    const fixture = TestBed.createComponent(RuleSetEditorPage);
    fixture.componentRef.setInput('id', shown.id);
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelector('mat-progress-bar[aria-label="Loading the rule set"]')).not.toBeNull();
    http.expectOne({ method: 'GET', url: `/api/rule-sets/${shown.id}` }).flush(shown);
    if (versions) {
      const req = http.expectOne((r) => r.url === '/api/rule-sets' && r.params.get('key') === shown.key);
      // Every version of the key, not only the latest.
      expect(req.request.params.has('latest')).toBe(false);
      req.flush({ items: versions, total: versions.length, page: 1, pageSize: 200 });
    }
    await fixture.whenStable();
    return { fixture, el, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('shows a built-in sample read-only, with its notice and a copy button', async () => {
    const { el, loader } = await render(sample);
    expect(textOf(el.querySelector('h1'))).toBe(`${maritime.name} version 1`);
    const note = textOf(el.querySelector('.sample-banner'));
    // The product's own wording.
    expect(note).toContain('Sample: verify against the current edition.');
    expect(note).toContain(maritime.body.sampleNotice!);
    expect(el.textContent).toContain('47 CFR 80.207 (c) — edition 2024');
    expect(await (await inputLabelled(loader, 'Name')).isDisabled()).toBe(true);
    expect(await (await inputLabelled(loader, 'Carrier suppression, at least')).isDisabled()).toBe(true);
    expect(() => buttonNamed(el, 'Save as a new version')).toThrow();
    expect(buttonNamed(el, 'Copy to your lab')).toBeTruthy();
  });

  it('saves the lab’s own latest version as a new version and says the old one stays', async () => {
    const { fixture, el, loader } = await render(own(2), [own(1), own(2)]);
    expect(el.textContent).toContain('Saving stores version 3; version 2 and the plans made from it do not change.');
    expect(el.querySelector('a[href="/rule-sets/rs-own-1"]')).not.toBeNull();
    await (await inputLabelled(loader, 'Carrier suppression, at least')).setValue('45');
    await (await inputLabelled(loader, 'Name')).setValue('  Kestrel maritime J3E (2026)  ');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/rule-sets/rs-own-2' });
    expect(req.request.body.name).toBe('Kestrel maritime J3E (2026)');
    expect(req.request.body.body.limits.carrierSuppression).toEqual({ ...maritime.body.limits.carrierSuppression, minDbBelowPep: 45 });
    // What the editor does not show is kept as it was.
    expect(req.request.body.body.references).toEqual(maritime.body.references);
    expect(req.request.body.body.uncertainty).toEqual(maritime.body.uncertainty);
    req.flush({ ...own(3), name: 'Kestrel maritime J3E (2026)' });
    await settle(fixture);
    // The product's own wording.
    expect(navigate).toHaveBeenCalledWith(['/rule-sets', 'rs-own-3'], { replaceUrl: true, state: { notice: 'Saved as version 3. Version 2 stays as it was, and plans made from it keep it.' } });
  });

  it('explains the decision rule chosen and sends a fixed guard band', async () => {
    const { fixture, el, loader } = await render(own(1), [own(1)]);
    // ILAC-G8:09/2019 4.2.1 (the sample's rule is simple acceptance).
    expect(el.textContent).toContain('Simple acceptance (ILAC-G8:09/2019 4.2.1, w = 0)');
    const rule = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="decisionKind"]' }));
    await rule.open();
    await rule.clickOptions({ text: 'Pass / fail with a guard band' });
    const mode = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="guardBandMode"]' }));
    await mode.open();
    await mode.clickOptions({ text: 'A fixed figure' });
    await (await inputLabelled(loader, 'Fixed guard band')).setValue('1.5');
    await fixture.whenStable();
    expect(el.textContent).toContain('ILAC-G8:09/2019 4.2.2');
    submit(el);
    const req = http.expectOne({ method: 'PUT', url: '/api/rule-sets/rs-own-1' });
    expect(req.request.body.body.decisionRule).toEqual({ kind: 'binary-guard-band', guardBand: 1.5 });
    req.flush(own(2));
    await settle(fixture);
  });

  it('refuses a limit outside the schema’s bounds and a missing source, with messages beside them', async () => {
    const { fixture, el, loader } = await render(own(1), [own(1)]);
    const carrier = await inputLabelled(loader, 'Carrier suppression, at least');
    await carrier.setValue('250');
    await carrier.blur();
    const source = (await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Source and edition' })))[0];
    const sourceInput = await source.getControl(MatInputHarness);
    await sourceInput!.setValue('');
    submit(el);
    await fixture.whenStable();
    // Bounds from shared/schemas/rule-set.ts as listed in rule-set-limits.ts; the product's own wording.
    expect(await errorsOf(loader, 'Carrier suppression, at least')).toEqual(['From 0 to 200 dB below PEP.']);
    expect(await source.getTextErrors()).toEqual(['Say where the number comes from, with its edition.']);
    expect(alerts(el)).toEqual(['Some fields need attention: see the messages beside them.']);
    http.expectNone((r) => r.method === 'PUT');
  });

  it('keeps an earlier version read-only and says so', async () => {
    const { el, loader } = await render(own(1), [own(1), own(2)]);
    // The product's own wording.
    expect(textOf(el.querySelector('.sample-banner'))).toContain('This is an earlier version, kept as it was. Open the latest version to make changes.');
    expect(await (await inputLabelled(loader, 'Name')).isDisabled()).toBe(true);
    expect(() => buttonNamed(el, 'Save as a new version')).toThrow();
    expect(el.querySelector('a[href="/rule-sets/rs-own-2"]')).not.toBeNull();
  });

  it('shows the server’s refusal of a save', async () => {
    const { fixture, el } = await render(own(1), [own(1)]);
    submit(el);
    http.expectOne({ method: 'PUT', url: '/api/rule-sets/rs-own-1' }).flush(...problem(409, 'Someone saved version 2 meanwhile: open it and make your change there.'));
    await fixture.whenStable();
    expect(alerts(el)).toEqual(['Someone saved version 2 meanwhile: open it and make your change there.']);
    expect(navigate).not.toHaveBeenCalled();
  });

  it('shows why a rule set cannot be opened', async () => {
    const fixture = TestBed.createComponent(RuleSetEditorPage);
    fixture.componentRef.setInput('id', 'rs-missing');
    await fixture.whenStable();
    http.expectOne('/api/rule-sets/rs-missing').flush(...problem(404, 'No rule set with this id in your lab.'));
    await fixture.whenStable();
    const el = fixture.nativeElement as HTMLElement;
    expect(alerts(el)).toEqual(['No rule set with this id in your lab.']);
    expect(el.querySelector('mat-progress-bar')).toBeNull();
    expect(el.querySelector('form')).toBeNull();
  });
});
