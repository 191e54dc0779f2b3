import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { LabDetailsApi, type LabDetails } from './lab-details-api';

// The server's contract: GET and PUT /api/organization and /api/organization/mail-settings (server/organizations/routes.ts).
describe('LabDetailsApi', () => {
  let api: LabDetailsApi;
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(LabDetailsApi);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // An invented lab (test fixture).
  const lab: LabDetails = { name: 'Kestrel Bay', code: 'KBRTL', addressLines: ['Unit 4, Quay Road'], email: null, phone: null, accreditation: null };

  it('reads the active organization’s details', async () => {
    const got = firstValueFrom(api.get());
    const req = http.expectOne('/api/organization');
    expect(req.request.method).toBe('GET');
    req.flush(lab);
    expect(await got).toEqual(lab);
  });

  it('saves the details without the fixed code and hands back the stored record', async () => {
    const { code: _code, ...body } = lab;
    const saved = firstValueFrom(api.save(body));
    const req = http.expectOne('/api/organization');
    expect(req.request.method).toBe('PUT');
    expect(req.request.body).toEqual(body);
    expect(req.request.body).not.toHaveProperty('code');
    req.flush(lab);
    expect((await saved).code).toBe('KBRTL');
  });

  it('reads and saves the lab’s e-mail choices', async () => {
    const got = firstValueFrom(api.mailSettings());
    const read = http.expectOne('/api/organization/mail-settings');
    expect(read.request.method).toBe('GET');
    read.flush({ attachPdfToEmail: false });
    expect(await got).toEqual({ attachPdfToEmail: false });
    const saved = firstValueFrom(api.saveMailSettings({ attachPdfToEmail: true }));
    const write = http.expectOne('/api/organization/mail-settings');
    expect(write.request.method).toBe('PUT');
    expect(write.request.body).toEqual({ attachPdfToEmail: true });
    write.flush({ attachPdfToEmail: true });
    expect(await saved).toEqual({ attachPdfToEmail: true });
  });
});
