import { HttpErrorResponse, HttpInterceptorFn, HttpRequest, HttpResponse } from '@angular/common/http';
import { inject } from '@angular/core';
import { catchError, filter, map, switchMap, throwError } from 'rxjs';
import { CsrfTokenStore } from './csrf-token-store';

export const CSRF_TOKEN_URL = '/api/auth/csrf';
export const CSRF_HEADER = 'x-csrf-token';

const STATE_CHANGING_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

function needsToken(req: HttpRequest<unknown>): boolean {
  return STATE_CHANGING_METHODS.has(req.method) && req.url.startsWith('/api/');
}

// The server answers a missing or stale token with 403 and an error code naming CSRF.
function isCsrfRejection(error: unknown): boolean {
  if (!(error instanceof HttpErrorResponse) || error.status !== 403) return false;
  const code: unknown = error.error?.error?.code;
  return typeof code === 'string' && code.toLowerCase().includes('csrf');
}

/** Adds the CSRF header to state-changing API calls; after a CSRF rejection it refetches the token once. */
export const csrfInterceptor: HttpInterceptorFn = (req, next) => {
  if (!needsToken(req)) return next(req);
  const store = inject(CsrfTokenStore);
  const fetchToken = () =>
    next(new HttpRequest<unknown>('GET', CSRF_TOKEN_URL)).pipe(
      filter((event): event is HttpResponse<{ token: string }> => event instanceof HttpResponse),
      map((response) => response.body!.token),
    );
  const sendWithToken = () =>
    store
      .token(fetchToken)
      .pipe(switchMap((token) => next(req.clone({ setHeaders: { [CSRF_HEADER]: token } }))));

  return sendWithToken().pipe(
    catchError((error: unknown) => {
      if (!isCsrfRejection(error)) return throwError(() => error);
      store.reset();
      return sendWithToken();
    }),
  );
};
