import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { SessionStore } from '../session/session-store';
import type { Role } from '../../../shared/access/roles';

/**
 * A guard that lets in people holding one of `roles` in the active organization. Anyone else is
 * taken to a screen they can use: the lab home for lab people, their reports for a manufacturer's.
 * Runs below signedInGuard, so the session is already loaded.
 * @example { path: 'settings', canActivate: [roleGuard(['lab-admin'])], ... }
 */
export function roleGuard(roles: readonly Role[]): CanActivateFn {
  return () => {
    const session = inject(SessionStore);
    if (session.hasRole(...roles)) return true;
    return inject(Router).createUrlTree([session.membership()?.kind === 'lab' ? '/' : '/reports']);
  };
}
