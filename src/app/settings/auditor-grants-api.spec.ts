import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { AuditorGrantsApi } from './auditor-grants-api';
import { LabDetailsApi } from './lab-details-api';

describe('AuditorGrantsApi and LabDetailsApi', () => {
  let http: HttpTestingController;
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  // server/auditors/routes.ts
  it('grants, lists and revokes auditor access', () => {
    const api = TestBed.inject(AuditorGrantsApi);
    const body = { email: 'assessor@body.example', scope: 'client' as const, clientId: 'c1', expiresOn: '2027-01-31' };
    api.create(body).subscribe();
    const post = http.expectOne('/api/auditor-grants');
    expect(post.request.body).toEqual(body);
    post.flush({});
    api.list().subscribe();
    http.expectOne((r) => r.url === '/api/auditor-grants' && r.method === 'GET').flush({ items: [] });
    api.revoke('g1').subscribe();
    expect(http.expectOne('/api/auditor-grants/g1').request.method).toBe('DELETE');
  });

  // The proposed GET/PUT /api/organization (no server route yet).
  it('reads and replaces the lab details', () => {
    const api = TestBed.inject(LabDetailsApi);
    api.get().subscribe();
    http.expectOne('/api/organization').flush({});
    const body = { name: 'Lab', addressLines: ['1 Road'], email: null, phone: null, accreditation: 'UKAS 0000' };
    api.save(body).subscribe();
    const put = http.expectOne('/api/organization');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual(body);
  });
});
