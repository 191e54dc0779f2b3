import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

export interface VerifiedReport {
  reportNumber: string;
  revision: number;
  lab: string;
  client: string;
  device: string;
  serialNumber: string;
  receivedOn: string;
  testedFrom: string;
  testedTo: string;
  issuedAt: string;
  sha256: string;
  status: 'current' | 'withdrawn' | 'superseded';
  reason: string | null;
  supersededBy: { reportNumber: string; revision: number; verifyPath: string } | null;
}

@Injectable({ providedIn: 'root' })
export class VerifyApi {
  private readonly http = inject(HttpClient);

  lookup(token: string): Observable<VerifiedReport> {
    return this.http.get<VerifiedReport>(`/api/verify/${encodeURIComponent(token)}`);
  }
}
