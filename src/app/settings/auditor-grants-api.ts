import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AuditorScope, CreateAuditorGrantBody } from '../../../shared/schemas/accounts';
import type { Page } from '../runs/runs-api';
import { listParams } from './list-params';

/** An auditor grant (server/auditors/grant-presenter.ts). */
export interface AuditorGrantRow {
  id: string;
  email: string;
  scope: AuditorScope;
  clientId: string | null;
  deviceId: string | null;
  expiresOn: string;
  note: string | null;
  status: 'pending' | 'active' | 'expired' | 'revoked';
  acceptedAt: string | null;
  revokedAt: string | null;
  createdAt: string;
}

/** Read-only access for outside auditors to the lab's issued reports (/api/auditor-grants). */
@Injectable({ providedIn: 'root' })
export class AuditorGrantsApi {
  private readonly http = inject(HttpClient);

  list(): Observable<Page<AuditorGrantRow>> {
    return this.http.get<Page<AuditorGrantRow>>('/api/auditor-grants', { params: listParams({ pageSize: 200 }) });
  }

  create(body: CreateAuditorGrantBody): Observable<AuditorGrantRow> {
    return this.http.post<AuditorGrantRow>('/api/auditor-grants', body);
  }

  revoke(id: string): Observable<void> {
    return this.http.delete<void>(`/api/auditor-grants/${encodeURIComponent(id)}`);
  }
}
