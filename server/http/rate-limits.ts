import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { slowDown } from 'express-slow-down';
import { RateLimitedError } from './errors';

const MINUTE_ms = 60_000;

/** Limits per window; exported so tests can reach them without guessing. */
export const RATE_LIMITS = {
  /** Failed sign-ins for one e-mail address from one client. */
  signInFailuresPerAccount: { limit: 10, windowMs: 15 * MINUTE_ms },
  /**
   * Failed sign-ins from one client across all addresses: past `delayAfter`, each answer waits one more step, up to
   * the ceiling. Slowed, never blocked, so a team behind one address is not locked out by one person's failures.
   */
  signInSlowdownPerClient: { delayAfter: 20, stepMs: 500, maxDelayMs: 10_000, windowMs: 15 * MINUTE_ms },
  /** Unknown, expired or used invitation and reset tokens from one client. */
  tokenFailuresPerClient: { limit: 30, windowMs: 15 * MINUTE_ms },
  /** Password-reset e-mails requested for one address from one client (each sends mail). */
  resetRequestsPerAccount: { limit: 5, windowMs: 60 * MINUTE_ms },
} as const;

interface Limit {
  limit: number;
  windowMs: number;
}

interface Slowdown {
  delayAfter: number;
  stepMs: number;
  maxDelayMs: number;
  windowMs: number;
}

function limiter(limit: Limit, options: { byAccount: boolean; failuresOnly: boolean }): RequestHandler {
  return rateLimit({
    ...limit,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    skipSuccessfulRequests: options.failuresOnly,
    keyGenerator: (req) => (options.byAccount ? `${clientKey(req)}|${emailOf(req)}` : clientKey(req)),
    handler: (_req, _res, next) => next(new RateLimitedError()),
  });
}

/** Per account a hard limit; per client a growing delay. Only failed sign-ins count. */
export function signInRateLimits(
  limits: { signInFailuresPerAccount: Limit; signInSlowdownPerClient: Slowdown } = RATE_LIMITS,
): RequestHandler[] {
  const client = limits.signInSlowdownPerClient;
  return [
    limiter(limits.signInFailuresPerAccount, { byAccount: true, failuresOnly: true }),
    slowDown({
      windowMs: client.windowMs,
      delayAfter: client.delayAfter,
      delayMs: (used) => (used - client.delayAfter) * client.stepMs,
      maxDelayMs: client.maxDelayMs,
      skipSuccessfulRequests: true,
      keyGenerator: clientKey,
    }),
  ];
}

/** Guessing token links is what this slows down, so only failed look-ups count. */
export function tokenLinkRateLimit(): RequestHandler {
  return limiter(RATE_LIMITS.tokenFailuresPerClient, { byAccount: false, failuresOnly: true });
}

export function resetRequestRateLimit(): RequestHandler {
  return limiter(RATE_LIMITS.resetRequestsPerAccount, { byAccount: true, failuresOnly: false });
}

function clientKey(req: Request): string {
  return ipKeyGenerator(req.ip ?? 'unknown');
}

// Runs before validation, so the body may be anything.
function emailOf(req: Request): string {
  const email: unknown = (req.body as { email?: unknown } | undefined)?.email;
  return typeof email === 'string' ? email.trim().toLowerCase() : '';
}
