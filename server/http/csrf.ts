import { createHmac, randomBytes } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { doubleCsrf } from 'csrf-csrf';
import { ForbiddenError } from './errors';

export const CSRF_HEADER = 'x-csrf-token';

export interface CsrfProtection {
  /** Sets the CSRF cookie and returns the token the client sends back in `x-csrf-token`. */
  issueToken(req: Request, res: Parameters<RequestHandler>[1]): string;
  /** Rejects POST/PUT/PATCH/DELETE without a valid token pair. */
  protect: RequestHandler;
}

declare module 'express-session' {
  interface SessionData {
    /** Random per-browser value the CSRF token is bound to; kept across sign-in so the token stays valid. */
    csrfSeed?: string;
  }
}

/**
 * Double-submit CSRF tokens (csrf-csrf) bound to a random seed held in the session. Sign-in and
 * sign-out regenerate the session id but keep the seed, so one token lasts for the browser session.
 */
export function createCsrfProtection(options: { secret: string; secureCookies: boolean }): CsrfProtection {
  // A derived key, so the session-cookie secret never signs anything else directly.
  const csrfSecret = createHmac('sha256', options.secret).update('taulens csrf').digest('hex');
  const { generateCsrfToken, validateRequest } = doubleCsrf({
    getSecret: () => csrfSecret,
    getSessionIdentifier: (req) => req.session?.csrfSeed ?? '',
    cookieName: options.secureCookies ? '__Host-taulens.csrf' : 'taulens.csrf',
    cookieOptions: { sameSite: 'lax', secure: options.secureCookies, httpOnly: true, path: '/' },
    getCsrfTokenFromRequest: (req) => req.get(CSRF_HEADER),
  });
  const unsafeMethods = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

  return {
    issueToken(req, res) {
      req.session.csrfSeed ??= randomBytes(16).toString('hex');
      return generateCsrfToken(req, res);
    },
    protect(req, _res, next) {
      if (!unsafeMethods.has(req.method) || (req.session?.csrfSeed && validateRequest(req))) {
        next();
        return;
      }
      next(
        new ForbiddenError('The security token is missing or out of date. Reload the page and try again.', {
          code: 'csrf_invalid',
        }),
      );
    },
  };
}
