import { TestBed } from '@angular/core/testing';
import { HttpEventType, provideHttpClient, type HttpEvent } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { PrecheckApi, type PrecheckAnswer } from './precheck-api';

// The server's contract: POST /api/precheck, multipart `file` (and `data`) with the upload fields and ruleSetId (DEVELOPERS.md).
describe('PrecheckApi', () => {
  let api: PrecheckApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(PrecheckApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  it('lists the sample rule sets a pre-check may use', async () => {
    const sets = firstValueFrom(api.sampleRuleSets());
    const req = http.expectOne('/api/precheck/rule-sets');
    expect(req.request.method).toBe('GET');
    req.flush({ items: [{ id: 'rs-1', key: 'us-maritime-hf-ssb', name: 'Maritime', version: 1 }] });
    expect((await sets).items[0].key).toBe('us-maritime-hf-ssb');
  });

  it('sends the capture and its data file as multipart with the fields, and reports progress then the answer', () => {
    const events: HttpEvent<PrecheckAnswer>[] = [];
    const meta = new File(['{}'], 'tx.sigmf-meta', { type: 'application/json' });
    const data = new File([new Uint8Array(8)], 'tx.sigmf-data');
    api.run({ file: meta, data }, { ruleSetId: 'rs-1', fullScaleDbm: 10, sideband: 'auto', centerHz: undefined }).subscribe((e) => events.push(e));
    const req = http.expectOne('/api/precheck');
    expect(req.request.method).toBe('POST');
    expect(req.request.reportProgress).toBe(true);
    const form = req.request.body as FormData;
    expect(form.get('ruleSetId')).toBe('rs-1');
    expect(form.get('fullScaleDbm')).toBe('10');
    expect(form.get('sideband')).toBe('auto');
    expect(form.has('centerHz')).toBe(false);
    expect((form.get('file') as File).name).toBe('tx.sigmf-meta');
    expect((form.get('data') as File).name).toBe('tx.sigmf-data');
    req.event({ type: HttpEventType.UploadProgress, loaded: 4, total: 10 });
    req.flush({ unaccredited: true, notice: 'Not an accredited result.' });
    expect(events.map((e) => e.type)).toEqual([HttpEventType.Sent, HttpEventType.UploadProgress, HttpEventType.Response]);
    const last = events.at(-1)!;
    expect(last.type === HttpEventType.Response && last.body?.unaccredited).toBe(true);
  });
});
