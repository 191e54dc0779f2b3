import { TestBed } from '@angular/core/testing';
import { HttpEventType, provideHttpClient, type HttpEvent } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { UploadsApi, uploadForm, type StoredFile, type UploadDetail } from './uploads-api';

// The server's contract: POST /api/runs/:id/cases/:caseId/uploads (multipart `file`, `data`, and the
// optional fields), GET /api/runs/:id/uploads, GET /api/uploads/:id and its file (DEVELOPERS.md, server/uploads).
describe('UploadsApi', () => {
  let api: UploadsApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(UploadsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const csv = () => new File(['frequency_hz,level_dbm\n2180000,-60\n'], 'mask.csv', { type: 'text/csv' });

  it('uploads a trace as multipart with its fields and reports progress before the answer', () => {
    const events: HttpEvent<UploadDetail>[] = [];
    api.upload('run 1', 'case/1', { file: csv() }, { format: 'trace-csv', referenceDbm: 50, centerHz: undefined }).subscribe((e) => events.push(e));
    const req = http.expectOne('/api/runs/run%201/cases/case%2F1/uploads');
    expect(req.request.method).toBe('POST');
    expect(req.request.reportProgress).toBe(true);
    const form = req.request.body as FormData;
    expect(form.get('format')).toBe('trace-csv');
    expect(form.get('referenceDbm')).toBe('50');
    expect(form.has('centerHz')).toBe(false);
    expect(form.has('data')).toBe(false);
    expect((form.get('file') as File).name).toBe('mask.csv');
    req.event({ type: HttpEventType.UploadProgress, loaded: 10, total: 36 });
    req.flush({ id: 'up-1' });
    expect(events.map((e) => e.type)).toEqual([HttpEventType.Sent, HttpEventType.UploadProgress, HttpEventType.Response]);
  });

  it('puts the fields first, then the file and its data part, leaving out empty fields', () => {
    const meta = new File(['{}'], 'tx.sigmf-meta');
    const data = new File([new Uint8Array(16)], 'tx.sigmf-data');
    const form = uploadForm({ file: meta, data }, { sampleRateHz: 48_000, sideband: '', fullScaleDbm: 10 });
    expect([...form.keys()]).toEqual(['sampleRateHz', 'fullScaleDbm', 'file', 'data']);
    expect(form.get('sampleRateHz')).toBe('48000');
    expect((form.get('data') as File).name).toBe('tx.sigmf-data');
  });

  it('lists a run’s uploads newest first, 50 at most, for one case when asked', async () => {
    const page = firstValueFrom(api.list('run-1'));
    const all = http.expectOne((r) => r.url === '/api/runs/run-1/uploads');
    expect(all.request.method).toBe('GET');
    expect(all.request.params.toString()).toBe('pageSize=50&sort=-createdAt');
    all.flush({ items: [], total: 0, page: 1, pageSize: 50 });
    expect((await page).total).toBe(0);
    api.list('run-1', 'case-2').subscribe();
    expect(http.expectOne((r) => r.url === '/api/runs/run-1/uploads').request.params.get('testCaseId')).toBe('case-2');
  });

  it('reads one upload, and its raw bytes from the address the server gave', async () => {
    const detail = firstValueFrom(api.get('up/1'));
    http.expectOne({ method: 'GET', url: '/api/uploads/up%2F1' }).flush({ id: 'up/1' });
    expect((await detail).id).toBe('up/1');
    const file: StoredFile = { name: 'mask.csv', sizeBytes: 36, sha256: 'a'.repeat(64), href: '/api/uploads/up-1/file' };
    const bytes = firstValueFrom(api.raw(file));
    const req = http.expectOne({ method: 'GET', url: '/api/uploads/up-1/file' });
    expect(req.request.responseType).toBe('blob');
    const blob = new Blob(['frequency_hz,level_dbm']);
    req.flush(blob);
    expect(await bytes).toBe(blob);
  });
});
