import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';
import { REDIRECT_ON_UNAUTHORISED, toApiError } from './api-error';
import { Session } from './session';
import { SIGN_IN_PATH, signInUrl } from './sign-in-redirect';

/** Turns every HTTP failure into an ApiError; a lost session sends the user to sign in and back. */
export const apiErrorInterceptor: HttpInterceptorFn = (req, next) => {
  const router = inject(Router);
  const session = inject(Session);
  return next(req).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      const apiError = toApiError(error);
      if (apiError.status === 401 && req.context.get(REDIRECT_ON_UNAUTHORISED)) {
        session.markSignedOut();
        // During a navigation the user is heading somewhere new; come back there after signing in.
        const returnUrl = router.currentNavigation()?.finalUrl?.toString() ?? router.url;
        if (!returnUrl.startsWith(SIGN_IN_PATH)) {
          void router.navigateByUrl(signInUrl(router, returnUrl));
        }
      }
      return throwError(() => apiError);
    }),
  );
};
