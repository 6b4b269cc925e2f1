import { Router } from 'express';
import { z } from 'zod';
import { servesDevOutbox } from '../config';
import type { AppContext } from '../http/app-context';
import type { CsrfProtection } from '../http/csrf';
import { resetRequestRateLimit, signInRateLimits, tokenLinkRateLimit } from '../http/rate-limits';
import { inputOf, validate } from '../http/validate';
import { InvitationService } from '../users/invitation.service';
import { newPasswordSchema } from '../users/password';
import { emailSchema, linkTokenParams, personNameSchema } from '../users/user-fields';
import { toUserSummary } from '../users/user-views';
import { UserService } from '../users/user.service';
import { AuthService } from './auth.service';
import { type PassportInstance, authenticateLocal, logIn, logOut } from './passport';
import { PasswordResetService } from './password-reset.service';
import { ResetRequestQueue } from './reset-request-queue';
import { currentUser, requireSignedIn } from './require-access';

const loginInput = { body: z.object({ email: emailSchema, password: z.string().min(1, 'is required').max(1000) }) };
const acceptInput = { params: linkTokenParams, body: z.object({ name: personNameSchema, password: newPasswordSchema }) };
const resetRequestInput = { body: z.object({ email: emailSchema }) };
const tokenInput = { params: linkTokenParams };
const resetInput = { params: linkTokenParams, body: z.object({ password: newPasswordSchema }) };

/** /api/auth: CSRF token, sign-in and sign-out, the session, invitation and password-reset links. */
export function authRouter(ctx: AppContext, deps: { passport: PassportInstance; csrf: CsrfProtection }): Router {
  const auth = new AuthService(ctx.dataSource);
  const users = new UserService(ctx.dataSource);
  const invitations = new InvitationService(ctx.dataSource, ctx.mailer, ctx.config.publicUrl);
  const resets = new PasswordResetService(ctx.dataSource, ctx.mailer, ctx.config.publicUrl);
  const resetRequests = new ResetRequestQueue(resets, ctx.logger);
  const tokenLimit = tokenLinkRateLimit();
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ token: deps.csrf.issueToken(req, res) });
  });

  router.post('/login', ...signInRateLimits(), validate(loginInput), async (req, res) => {
    const user = await authenticateLocal(deps.passport, req, res);
    await logIn(req, user);
    await users.recordSignIn(user.id);
    res.json({ user: toUserSummary(user) });
  });

  router.post('/logout', async (req, res) => {
    if (req.user) await logOut(req);
    res.status(204).end();
  });

  router.get('/me', requireSignedIn, async (req, res) => {
    res.json(await auth.describeSession(currentUser(req), servesDevOutbox(ctx.config)));
  });

  router.get('/invitations/:token', tokenLimit, validate(tokenInput), async (_req, res) => {
    res.json(await invitations.lookup(inputOf(res, tokenInput).params.token));
  });

  router.post('/invitations/:token/accept', tokenLimit, validate(acceptInput), async (req, res) => {
    const { params, body } = inputOf(res, acceptInput);
    const user = await invitations.accept(params.token, body);
    await logIn(req, user);
    await users.recordSignIn(user.id);
    res.json({ user: toUserSummary(user) });
  });

  router.post('/password-reset', resetRequestRateLimit(), validate(resetRequestInput), (_req, res) => {
    resetRequests.enqueue(inputOf(res, resetRequestInput).body.email);
    res.status(202).json({ status: 'accepted' });
  });

  router.post('/invitations/:token/join', tokenLimit, requireSignedIn, validate(tokenInput), async (req, res) => {
    res.json(await invitations.join(inputOf(res, tokenInput).params.token, currentUser(req)));
  });

  router.get('/password-reset/:token', tokenLimit, validate(tokenInput), async (_req, res) => {
    res.json(await resets.lookup(inputOf(res, tokenInput).params.token));
  });

  router.post('/password-reset/:token', tokenLimit, validate(resetInput), async (_req, res) => {
    const { params, body } = inputOf(res, resetInput);
    await resets.complete(params.token, body.password);
    res.status(204).end();
  });

  return router;
}
