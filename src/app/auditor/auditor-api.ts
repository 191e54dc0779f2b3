import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '../runs/runs-api';

/** A report a live auditor grant covers (server/auditors/auditor-reports.ts). */
export interface GrantedReport {
  id: string;
  reportNumber: string;
  revision: number;
  issuedAt: string;
  sha256: string;
  pageCount: number;
  lab: string;
  client: string;
  device: string;
  serialNumber: string;
  status: 'current' | 'withdrawn' | 'superseded';
  verifyPath: string;
}

/** Typed access to the auditor's read-only view: GET /api/auditor/reports and their PDFs. */
@Injectable({ providedIn: 'root' })
export class AuditorApi {
  private readonly http = inject(HttpClient);

  list(query: { page: number; pageSize: number; sort: string; search?: string }): Observable<Page<GrantedReport>> {
    let params = new HttpParams();
    for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params = params.set(k, String(v));
    return this.http.get<Page<GrantedReport>>('/api/auditor/reports', { params });
  }

  pdf(id: string): Observable<Blob> {
    return this.http.get(`/api/auditor/reports/${encodeURIComponent(id)}/pdf`, { responseType: 'blob' });
  }
}
