import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { CreateClientBody } from '../../../shared/schemas/records';
import type { Page } from '../runs/runs-api';
import { listParams } from '../settings/list-params';

/** A client of the lab as the API shows it (server/clients/routes.ts presentClient). */
export interface Client {
  id: string;
  name: string;
  addressLines: string[];
  contactName: string;
  contactEmail: string;
  invoiceLater: boolean;
  /** Set once the client has its own organization on Sidecheck (its report portal). */
  clientOrganizationId: string | null;
  createdAt: string;
}

/** The lab's clients (/api/clients) and the invitation of a client's first administrator. */
@Injectable({ providedIn: 'root' })
export class ClientsApi {
  private readonly http = inject(HttpClient);

  list(query: { page?: number; pageSize?: number; search?: string; sort?: string } = {}): Observable<Page<Client>> {
    return this.http.get<Page<Client>>('/api/clients', { params: listParams({ pageSize: 200, ...query }) });
  }

  get(id: string): Observable<Client> {
    return this.http.get<Client>(`/api/clients/${encodeURIComponent(id)}`);
  }

  create(body: CreateClientBody): Observable<Client> {
    return this.http.post<Client>('/api/clients', body);
  }

  update(id: string, body: CreateClientBody): Observable<Client> {
    return this.http.put<Client>(`/api/clients/${encodeURIComponent(id)}`, body);
  }

  /** E-mails the client's contact (or `email`) a link to become the first administrator of its organization. */
  inviteAdministrator(id: string, email?: string): Observable<{ email: string; expiresAt: string }> {
    return this.http.post<{ email: string; expiresAt: string }>(`/api/clients/${encodeURIComponent(id)}/invitations`, email ? { email } : {});
  }
}
