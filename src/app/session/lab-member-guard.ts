import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { SessionStore } from './session-store';

/** Lab screens: a manufacturer's people are taken to their reports instead. */
export const labMemberGuard: CanActivateFn = () => {
  const session = inject(SessionStore);
  return session.membership()?.kind === 'lab' ? true : inject(Router).createUrlTree(['/reports']);
};
