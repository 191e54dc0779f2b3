import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { DevicesApi } from './devices-api';

// The server's contract: server/devices/routes.ts (PUT replaces the record).
describe('DevicesApi', () => {
  it('reads one device and replaces it with PUT', () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const api = TestBed.inject(DevicesApi);
    const http = TestBed.inject(HttpTestingController);
    api.get('d1').subscribe();
    expect(http.expectOne('/api/devices/d1').request.method).toBe('GET');
    const body = { clientId: 'c1', manufacturer: 'M', model: 'X', serialNumber: 'S', ratedPepW: 100, emissionDesignator: '2K70J3E', frequencyMinHz: 1.6e6, frequencyMaxHz: 27.5e6, modes: ['USB' as const], receivedOn: '2026-11-30' };
    api.update('d1', body).subscribe();
    const put = http.expectOne('/api/devices/d1');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual(body);
    http.verify();
  });
});
