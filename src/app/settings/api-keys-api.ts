import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '../runs/runs-api';
import { listParams } from './list-params';

/** An API key as listed (server/api-keys/api-key-presenter.ts): its prefix, never the secret. */
export interface ApiKeyRow {
  id: string;
  name: string;
  prefix: string;
  createdAt: string;
  createdBy: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** The answer to making a key: the only time the whole key is sent. */
export interface NewApiKey extends ApiKeyRow {
  key: string;
}

/** The lab's bench-automation keys (/api/api-keys, lab administrators only). */
@Injectable({ providedIn: 'root' })
export class ApiKeysApi {
  private readonly http = inject(HttpClient);

  list(): Observable<Page<ApiKeyRow>> {
    return this.http.get<Page<ApiKeyRow>>('/api/api-keys', { params: listParams({ pageSize: 200 }) });
  }

  create(name: string): Observable<NewApiKey> {
    return this.http.post<NewApiKey>('/api/api-keys', { name });
  }

  revoke(id: string): Observable<void> {
    return this.http.delete<void>(`/api/api-keys/${encodeURIComponent(id)}`);
  }
}
