import { inject } from '@angular/core';
import { Router, type CanActivateFn } from '@angular/router';
import { SessionStore } from './session-store';

/**
 * Lab screens: a manufacturer's people are taken to their portal, and a person with no
 * membership at all (an outside auditor, who reads through a grant) to the reports shared with them.
 */
export const labMemberGuard: CanActivateFn = () => {
  const session = inject(SessionStore);
  const kind = session.membership()?.kind;
  if (kind === 'lab') return true;
  return inject(Router).createUrlTree([kind === 'manufacturer' ? '/portal' : '/auditor']);
};
