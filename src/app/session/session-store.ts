import { HttpBackend, HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';
import type { Role } from '../../../shared/access/roles';

export interface Membership {
  organizationId: string;
  /** Sent by the server beside the id (server/auth/tokens.ts loadPrincipal), for the organization switcher. */
  organizationName?: string;
  kind: 'lab' | 'manufacturer';
  roles: Role[];
}
export interface SessionUser {
  userId: string;
  email: string;
  displayName: string;
  memberships: Membership[];
}
interface SessionAnswer {
  accessToken: string;
  expiresIn: number;
  user: SessionUser;
}

const ORG_KEY = 'sidecheck.activeOrganization';

/**
 * Who is signed in, with which access token, in which organization. The access token lives only in
 * memory; the refresh token is an httpOnly cookie the browser sends to /api/auth alone.
 */
@Injectable({ providedIn: 'root' })
export class SessionStore {
  // HttpBackend bypasses the interceptors, so refreshing never recurses into itself.
  private readonly raw = new HttpClient(inject(HttpBackend));
  private readonly token = signal<string | null>(null);
  private refreshing: Promise<boolean> | null = null;

  readonly user = signal<SessionUser | null>(null);
  readonly activeOrganizationId = signal<string | null>(localStorage.getItem(ORG_KEY));
  readonly membership = computed(() => {
    const user = this.user();
    if (!user) return null;
    return user.memberships.find((m) => m.organizationId === this.activeOrganizationId()) ?? user.memberships[0] ?? null;
  });
  readonly roles = computed<Role[]>(() => this.membership()?.roles ?? []);

  accessToken(): string | null {
    return this.token();
  }

  hasRole(...roles: Role[]): boolean {
    return this.roles().some((r) => roles.includes(r));
  }

  async signIn(email: string, password: string): Promise<void> {
    this.accept(await firstValueFrom(this.raw.post<SessionAnswer>('/api/auth/sign-in', { email, password }, { withCredentials: true })));
  }

  /** Try the refresh cookie; resolves false when there is no live session. Concurrent callers share one attempt. */
  refresh(): Promise<boolean> {
    this.refreshing ??= firstValueFrom(this.raw.post<SessionAnswer>('/api/auth/refresh', {}, { withCredentials: true }))
      .then((answer) => {
        this.accept(answer);
        return true;
      })
      .catch(() => {
        this.clear();
        return false;
      })
      .finally(() => (this.refreshing = null));
    return this.refreshing;
  }

  async signOut(): Promise<void> {
    await firstValueFrom(this.raw.post('/api/auth/sign-out', {}, { withCredentials: true })).catch(() => undefined);
    this.clear();
  }

  switchOrganization(organizationId: string): void {
    this.activeOrganizationId.set(organizationId);
    localStorage.setItem(ORG_KEY, organizationId);
  }

  private accept(answer: SessionAnswer): void {
    this.token.set(answer.accessToken);
    this.user.set(answer.user);
    const active = this.activeOrganizationId();
    if (!answer.user.memberships.some((m) => m.organizationId === active)) {
      this.activeOrganizationId.set(answer.user.memberships[0]?.organizationId ?? null);
    }
  }

  private clear(): void {
    this.token.set(null);
    this.user.set(null);
  }
}
