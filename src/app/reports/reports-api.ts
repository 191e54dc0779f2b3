import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '../runs/runs-api';

export interface ReportRow {
  id: string;
  runId: string;
  reportNumber: string;
  revision: number;
  sha256: string;
  pageCount: number;
  summary: { device?: string; client?: string; lab?: string; verdicts?: string[] };
  issuedAt: string;
  status: 'current' | 'withdrawn' | 'superseded';
  verifyPath: string;
}

@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  list(query: { page: number; pageSize: number; sort: string; search?: string }): Observable<Page<ReportRow>> {
    let params = new HttpParams();
    for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params = params.set(k, String(v));
    return this.http.get<Page<ReportRow>>('/api/reports', { params });
  }

  pdf(id: string): Observable<Blob> {
    return this.http.get(`/api/reports/${encodeURIComponent(id)}/pdf`, { responseType: 'blob' });
  }
}
