import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { firstValueFrom } from 'rxjs';
import { HomeApi } from './home-api';

describe('HomeApi', () => {
  it('reads the four panels in one request (server/home/routes.ts)', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const p = firstValueFrom(TestBed.inject(HomeApi).home());
    const answer = { runsByState: { testing: 2 }, awaitingMyReview: [], calibrationDue: [], recentActivity: [] };
    http.expectOne('/api/home').flush(answer);
    expect(await p).toEqual(answer);
    http.verify();
  });
});
