import { HttpErrorResponse, type HttpInterceptorFn, type HttpRequest } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, switchMap, throwError } from 'rxjs';
import { Session } from './session';

/**
 * The auth routes that act for the signed-in person and so need the access token (switching
 * workshop, signing out everywhere); the other auth routes are for signed-out visitors.
 */
const SIGNED_IN_AUTH_ROUTES = new Set(['/api/auth/workshop', '/api/auth/sign-out-everywhere']);

/**
 * Adds the bearer token to API calls. When the API answers 401 (the access token expired),
 * refreshes the session once and retries the call with the new token; the signed-out auth
 * routes (sign-in, refresh, links) are left alone so a refused sign-in or refresh never loops.
 */
export const authInterceptor: HttpInterceptorFn = (req, next) => {
  if (!req.url.startsWith('/api/')) return next(req);
  if (req.url.startsWith('/api/auth/') && !SIGNED_IN_AUTH_ROUTES.has(req.url)) return next(req);
  const session = inject(Session);
  return next(withBearer(req, session.accessToken())).pipe(
    catchError((err: unknown) => {
      if (!(err instanceof HttpErrorResponse) || err.status !== 401) return throwError(() => err);
      return session
        .refresh()
        .pipe(switchMap((token) => (token ? next(withBearer(req, token)) : throwError(() => err))));
    }),
  );
};

function withBearer(req: HttpRequest<unknown>, token: string | null): HttpRequest<unknown> {
  return token ? req.clone({ setHeaders: { Authorization: `Bearer ${token}` } }) : req;
}
