import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Role } from '../../../shared/access/roles';
import type { CreateInvitationBody } from '../../../shared/schemas/accounts';
import type { Page } from '../runs/runs-api';
import { listParams } from './list-params';

/** A member of the active organization (server/accounts/members.ts MemberRow). */
export interface Member {
  userId: string;
  name: string;
  email: string;
  roles: Role[];
  memberSince: string;
}

/** An open invitation (server/accounts/invitation-presenter.ts): never its token. */
export interface OpenInvitation {
  id: string;
  organizationId: string;
  organizationName?: string;
  email: string;
  role: Role | null;
  status: 'pending' | 'accepted' | 'revoked' | 'expired';
  expiresAt: string;
  createdAt: string;
}

/** Members and invitations of the active organization (GET/PUT/DELETE /api/members, /api/invitations). */
@Injectable({ providedIn: 'root' })
export class PeopleApi {
  private readonly http = inject(HttpClient);

  members(query: { page?: number; pageSize?: number; search?: string } = {}): Observable<Page<Member>> {
    return this.http.get<Page<Member>>('/api/members', { params: listParams({ pageSize: 200, ...query }) });
  }

  setRoles(userId: string, roles: Role[]): Observable<{ userId: string; roles: Role[] }> {
    return this.http.put<{ userId: string; roles: Role[] }>(`/api/members/${encodeURIComponent(userId)}/roles`, { roles });
  }

  removeMember(userId: string): Observable<void> {
    return this.http.delete<void>(`/api/members/${encodeURIComponent(userId)}`);
  }

  invitations(): Observable<Page<OpenInvitation>> {
    return this.http.get<Page<OpenInvitation>>('/api/invitations', { params: listParams({ pageSize: 200 }) });
  }

  invite(body: CreateInvitationBody): Observable<OpenInvitation> {
    return this.http.post<OpenInvitation>('/api/invitations', body);
  }

  revokeInvitation(id: string): Observable<void> {
    return this.http.delete<void>(`/api/invitations/${encodeURIComponent(id)}`);
  }
}
