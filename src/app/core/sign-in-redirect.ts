import { Router, UrlTree } from '@angular/router';

export const SIGN_IN_PATH = '/sign-in';

/** The sign-in page, remembering where to go afterwards. */
export function signInUrl(router: Router, returnUrl: string): UrlTree {
  return router.createUrlTree([SIGN_IN_PATH], { queryParams: { returnUrl } });
}

/**
 * Where to go after signing in: only paths inside this app are followed, so a crafted link cannot
 * send a user to another site.
 */
export function safeReturnUrl(returnUrl: string | null | undefined): string {
  if (!returnUrl || !returnUrl.startsWith('/') || returnUrl.startsWith('//') || returnUrl.startsWith('/\\')) {
    return '/projects';
  }
  if (returnUrl.startsWith(SIGN_IN_PATH)) return '/projects';
  return returnUrl;
}
