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
  summary: { device?: string; serialNumber?: string; client?: string; lab?: string; verdicts?: string[] };
  issuedAt: string;
  status: 'current' | 'withdrawn' | 'superseded';
  verifyPath: string;
}

/** GET /api/reports/:id: the row plus why its status changed and what superseded it. */
export interface ReportDetail extends ReportRow {
  reason: string | null;
  supersededById: string | null;
}

@Injectable({ providedIn: 'root' })
export class ReportsApi {
  private readonly http = inject(HttpClient);

  list(query: { page: number; pageSize: number; sort: string; search?: string }): Observable<Page<ReportRow>> {
    let params = new HttpParams();
    for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== '') params = params.set(k, String(v));
    return this.http.get<Page<ReportRow>>('/api/reports', { params });
  }

  get(id: string): Observable<ReportDetail> {
    return this.http.get<ReportDetail>(`/api/reports/${encodeURIComponent(id)}`);
  }

  pdf(id: string): Observable<Blob> {
    return this.http.get(`/api/reports/${encodeURIComponent(id)}/pdf`, { responseType: 'blob' });
  }

  /** Withdraw an issued report; the record stays and says why (ISO/IEC 17025:2017 7.8.8). */
  withdraw(id: string, reason: string): Observable<ReportDetail> {
    return this.http.post<ReportDetail>(`/api/reports/${encodeURIComponent(id)}/withdraw`, { reason });
  }

  /** Reopen the report's run for correction; issuing it again makes the next revision. */
  revise(runId: string, reason: string): Observable<{ id: string; state: string }> {
    return this.http.post<{ id: string; state: string }>(`/api/runs/${encodeURIComponent(runId)}/revise`, { reason });
  }
}
