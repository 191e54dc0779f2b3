import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { PrecheckPage } from './precheck-page';
import type { PrecheckAnswer } from './precheck-api';

jest.mock('uplot', () => ({
  __esModule: true,
  default: jest.fn().mockImplementation(() => ({ root: document.createElement('div'), scales: { x: {} }, batch: (f: () => void) => f(), setData: jest.fn(), setScale: jest.fn(), setSize: jest.fn(), destroy: jest.fn() })),
}));
jest.setTimeout(20_000);

const answer = (): PrecheckAnswer => ({
  unaccredited: true,
  notice: 'Engineering pre-check: not an accredited result and cannot become a report',
  ruleSet: { id: 'rs-1', key: 'us-maritime-hf-ssb', name: 'US maritime HF SSB (sample)', version: 1, sampleNotice: 'Sample rule set.' },
  format: 'wav',
  file: { name: 'tone.wav', sizeBytes: 1000, sha256: 'a'.repeat(64) },
  data: null,
  parameters: {},
  analysis: { source: 'iq', format: 'wav', datatype: 'ri16_le', sampleRateHz: 48_000, sampleCount: 48_000, centerHz: null, figures: { sideband: 'usb', pepDbfs: -6, meanPowerDbfs: -6, pepDbm: null, meanPowerDbm: null, carrierSuppressionDb: 50, unwantedSidebandSuppressionDb: 35.16, imd3Db: null, imd5Db: null, occupiedBandwidthHz: 30, tones: [] }, plot: { x: [-1000, 1000], y: [-80, -20] } },
  checks: [
    { kind: 'unwanted-sideband', label: 'Unwanted-sideband suppression', value: 35.16, unit: 'dB below the wanted tone', limit: 40, limitText: 'at least 40 dB below the wanted sideband', margin: -4.84, expandedUncertainty: 0.6, verdict: 'fail', decisionRuleText: 'Simple acceptance', inputs: {} },
    { kind: 'intermodulation', label: 'Two-tone intermodulation (IMD)', problem: 'No two-tone signal was found in the capture.' },
  ],
  phasing: null,
});

describe('PrecheckPage', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  it('says before and after the run that it is not an accredited result, with every margin and the phasing diagnosis', async () => {
    const fixture = TestBed.createComponent(PrecheckPage);
    await fixture.whenStable();
    http.expectOne('/api/precheck/rule-sets').flush({ items: [{ id: 'rs-1', key: 'us-maritime-hf-ssb', name: 'US maritime HF SSB (sample)', version: 1 }] });
    await fixture.whenStable();
    const el: HTMLElement = fixture.nativeElement;
    expect(el.querySelector('.unaccredited')!.textContent).toContain('Engineering pre-check — not an accredited result; it cannot become a report.');
    const wav = new Uint8Array(44);
    wav.set(new TextEncoder().encode('RIFF'), 0);
    wav.set(new TextEncoder().encode('WAVE'), 8);
    await (fixture.componentInstance as unknown as { choose(f: File[]): Promise<void> }).choose([new File([wav], 'tone.wav')]);
    await fixture.whenStable();
    (el.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit'));
    const req = http.expectOne({ method: 'POST', url: '/api/precheck' });
    expect((req.request.body as FormData).get('ruleSetId')).toBe('rs-1');
    expect((req.request.body as FormData).get('format')).toBe('wav');
    req.flush(answer());
    await fixture.whenStable();
    expect(el.querySelector('.result-notice')!.textContent).toContain('not an accredited result and cannot become a report');
    expect(el.textContent).toContain('-4.84');
    expect(el.textContent).toContain('Not judged: No two-tone signal');
    // 35.16 dB is what a 2° phase error alone gives (cot²(1°), published image-rejection relation).
    expect(el.textContent).toContain('phase error of 2.00°');
  });
});
