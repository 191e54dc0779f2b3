import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { AcceptInvitationBody, SignUpBody } from '../../../shared/schemas/accounts';
import type { Role } from '../../../shared/access/roles';

/** What an invitation link is for (GET /api/invitations/lookup/:token, server/accounts/accept-invitation.ts). */
export interface InvitationLookup {
  kind: 'member' | 'auditor';
  organizationName: string;
  organizationKind: 'lab' | 'manufacturer';
  role: Role | null;
  roleLabel: string | null;
  email: string;
  accountExists: boolean;
  expiresAt: string;
  grant: { scope: string; expiresOn: string } | null;
}

/** The answer to accepting: a new account is signed in at once (the refresh cookie is set). */
export interface InvitationAccepted {
  accountCreated: boolean;
  kind: 'member' | 'auditor';
  organizationId: string;
}

/**
 * The public account screens' calls: sign-up, invitation links and password reset. Sign-up and a
 * new account's acceptance set the refresh cookie; the caller then loads the session with
 * SessionStore.refresh(), so the access token is handled in one place.
 */
@Injectable({ providedIn: 'root' })
export class AccountsApi {
  private readonly http = inject(HttpClient);

  signUp(body: SignUpBody): Observable<{ organizationId: string }> {
    return this.http.post<{ organizationId: string }>('/api/auth/sign-up', body, { withCredentials: true });
  }

  lookupInvitation(token: string): Observable<InvitationLookup> {
    return this.http.get<InvitationLookup>(`/api/invitations/lookup/${encodeURIComponent(token)}`);
  }

  acceptInvitation(body: AcceptInvitationBody): Observable<InvitationAccepted> {
    return this.http.post<InvitationAccepted>('/api/invitations/accept', body, { withCredentials: true });
  }

  /** Always answers the same, whether or not the account exists (the server's wording in `detail`). */
  requestPasswordReset(email: string): Observable<{ detail: string }> {
    return this.http.post<{ detail: string }>('/api/auth/password-reset/request', { email });
  }

  completePasswordReset(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset/complete', { token, password });
  }
}
