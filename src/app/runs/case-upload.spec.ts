import { TestBed } from '@angular/core/testing';
import { HttpEventType, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { CaseUpload } from './case-upload';
import type { UploadDetail } from './uploads-api';

// No canvas in jsdom: the chart's uPlot is a stand-in here (the browser suite draws the real one).
jest.mock('uplot', () => ({
  __esModule: true,
  default: jest.fn().mockImplementation(() => ({ root: document.createElement('div'), scales: { x: {} }, batch: (f: () => void) => f(), setData: jest.fn(), setScale: jest.fn(), setSize: jest.fn(), destroy: jest.fn() })),
}));

const URL_ = '/api/runs/run-1/cases/case-1/uploads';
const csv = () => new File(['# RBW: 300 Hz\nfrequency_hz,level_dbm\n2180000,-60\n2190000,-62\n'], 'mask.csv', { type: 'text/csv' });

async function render(kind = 'emission-mask') {
  const fixture = TestBed.createComponent(CaseUpload);
  fixture.componentRef.setInput('runId', 'run-1');
  fixture.componentRef.setInput('caseId', 'case-1');
  fixture.componentRef.setInput('kind', kind);
  fixture.componentRef.setInput('maskReference', 'mean');
  fixture.componentRef.setInput('editable', true);
  await fixture.whenStable();
  return { fixture, el: fixture.nativeElement as HTMLElement, c: fixture.componentInstance as unknown as { choose(f: File[]): Promise<void> } };
}

function typeInto(el: HTMLElement, name: string, value: string) {
  const input = el.querySelector(`input[name="${name}"]`) as HTMLInputElement;
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

const detail = (): UploadDetail => ({
  id: 'up-1', runId: 'run-1', testCaseId: 'case-1', format: 'trace-csv',
  file: { name: 'mask.csv', sizeBytes: 70, sha256: 'a'.repeat(64), href: '/api/uploads/up-1/file' }, data: null,
  parameters: {}, engineVersion: '1.2.0', uploadedBy: 'u', viaApiKey: false, createdAt: '2026-11-02T10:00:00Z',
  analysis: { source: 'trace', pointCount: 2, startHz: 2_180_000, stopHz: 2_190_000, rbwHz: 300, carrierHz: 2_182_000, sideband: 'usb', peak: { frequencyHz: 2_180_000, levelDbm: -60 }, plot: { x: [2_180_000, 2_190_000], y: [-60, -62] } },
  result: {
    id: 'res', uploadId: 'up-1', engineVersion: '1.2.0', value: -60, unit: 'dBm at the worst point', limit: -13, margin: 47, expandedUncertainty: 0.6, coverageFactor: 2, verdict: 'pass', createdAt: '2026-11-02T10:00:00Z',
    detail: { limitText: 'emission mask relative to the mean power', decisionRuleText: 'Simple acceptance', mask: { assignedHz: 2_183_400, referenceDbm: 50, exemptWithinOffsetHz: 1500, reference: 'mean', segments: [], worstFrequencyHz: 2_180_000, worstOffsetHz: -3400, worstMarginDb: 47, pointCount: 2 } },
  },
});

// The first render compiles Angular Material's templates, which can take seconds on a cold run.
jest.setTimeout(20_000);

describe('CaseUpload', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('sends a trace with its reference level as multipart, shows progress, and Cancel aborts the request', async () => {
    const { fixture, el, c } = await render();
    await c.choose([csv()]);
    await fixture.whenStable();
    expect(el.textContent).toContain('Spectrum-analyzer trace (CSV)');
    typeInto(el, 'referenceDbm', '50');
    await fixture.whenStable();
    (el.querySelector('form.fields') as HTMLFormElement).dispatchEvent(new Event('submit'));
    const req = http.expectOne({ method: 'POST', url: URL_ });
    const form = req.request.body as FormData;
    expect(form.get('format')).toBe('trace-csv');
    expect(form.get('referenceDbm')).toBe('50');
    expect((form.get('file') as File).name).toBe('mask.csv');
    req.event({ type: HttpEventType.UploadProgress, loaded: 35, total: 70 });
    await fixture.whenStable();
    expect(el.textContent).toContain('50 % of');
    [...el.querySelectorAll('button')].find((b) => b.textContent!.trim() === 'Cancel')!.click();
    expect(req.cancelled).toBe(true);
    await fixture.whenStable();
    expect(el.textContent).toContain('Upload cancelled. Nothing was stored.');
  });

  it('shows the stored analysis with the worst point once the server answers', async () => {
    const { fixture, el, c } = await render();
    await c.choose([csv()]);
    await fixture.whenStable();
    typeInto(el, 'referenceDbm', '50');
    await fixture.whenStable();
    (el.querySelector('form.fields') as HTMLFormElement).dispatchEvent(new Event('submit'));
    http.expectOne({ method: 'POST', url: URL_ }).flush(detail());
    await fixture.whenStable();
    expect(el.textContent).toContain('Worst point:');
    expect(el.textContent).toContain('47.00 dB inside the mask');
    expect(el.querySelector('sc-spectrum-chart')).not.toBeNull();
  });

  it('shows the server’s refusal, and refuses a file the case cannot be judged from before sending', async () => {
    const { fixture, el, c } = await render('unwanted-sideband');
    await c.choose([csv()]);
    await fixture.whenStable();
    expect(el.querySelector('[role="alert"]')!.textContent).toMatch(/I\/Q capture/);
    const mask = await render();
    await mask.c.choose([csv()]);
    await mask.fixture.whenStable();
    typeInto(mask.el, 'referenceDbm', '50');
    await mask.fixture.whenStable();
    (mask.el.querySelector('form.fields') as HTMLFormElement).dispatchEvent(new Event('submit'));
    http.expectOne({ method: 'POST', url: URL_ }).flush({ detail: 'Tomasz’s analyzer s/n 1 was due for calibration on 2026-01-01.' }, { status: 409, statusText: 'Conflict' });
    await mask.fixture.whenStable();
    expect(mask.el.querySelector('[role="alert"]')!.textContent).toContain('was due for calibration');
    expect(fixture).toBeTruthy();
  });
});
