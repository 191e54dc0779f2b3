import { HttpErrorResponse, type HttpHandlerFn, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, from, switchMap, throwError } from 'rxjs';
import { SessionStore } from './session-store';

function withAuth(req: HttpRequest<unknown>, session: SessionStore): HttpRequest<unknown> {
  const token = session.accessToken();
  const org = session.membership()?.organizationId;
  const headers: Record<string, string> = {};
  if (token) headers['Authorization'] = `Bearer ${token}`;
  if (org) headers['X-Organization-Id'] = org;
  return req.clone({ setHeaders: headers });
}

/** Adds the access token and active organization; on a 401, refreshes once and retries. */
export const authInterceptor: HttpInterceptorFn = (req: HttpRequest<unknown>, next: HttpHandlerFn) => {
  if (!req.url.startsWith('/api/') || req.url.startsWith('/api/auth/')) return next(req);
  const session = inject(SessionStore);
  const router = inject(Router);
  return next(withAuth(req, session)).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse) || error.status !== 401) return throwError(() => error);
      return from(session.refresh()).pipe(
        switchMap((ok) => {
          if (!ok) {
            void router.navigate(['/sign-in'], { queryParams: { next: router.url } });
            return throwError(() => error);
          }
          return next(withAuth(req, session));
        }),
      );
    }),
  );
};
