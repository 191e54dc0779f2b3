import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { SessionStore } from './session-store';

/** Lets a signed-in person through; otherwise tries the refresh cookie, then sends them to sign in. */
export const signedInGuard: CanActivateFn = async (_route, state) => {
  const session = inject(SessionStore);
  const router = inject(Router);
  if (session.user() || (await session.refresh())) return true;
  return router.createUrlTree(['/sign-in'], { queryParams: state.url && state.url !== '/' ? { next: state.url } : {} });
};
