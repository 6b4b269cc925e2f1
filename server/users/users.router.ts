import { Router } from 'express';
import { z } from 'zod';
import { PasswordResetService } from '../auth/password-reset.service';
import { currentUser, requireAdmin } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { PROJECT_ROLES } from '../projects/project-role';
import { InvitationService } from './invitation.service';
import { emailSchema, personNameSchema, userIdParams } from './user-fields';
import { UserService } from './user.service';

const inviteInput = {
  body: z
    .object({
      email: emailSchema,
      name: personNameSchema.optional(),
      isAdmin: z.boolean().optional(),
      projectId: z.uuid('is not a valid project id').optional(),
      role: z.enum(PROJECT_ROLES).optional(),
    })
    .refine((b) => (b.projectId === undefined) === (b.role === undefined), {
      message: 'give both projectId and role, or neither',
      path: ['role'],
    }),
};
const userInput = { params: userIdParams };

/** /api/users: site administration of accounts. Every route is for site admins only. */
export function usersRouter(ctx: AppContext): Router {
  const users = new UserService(ctx.dataSource);
  const invitations = new InvitationService(ctx.dataSource, ctx.mailer, ctx.config.publicUrl);
  const resets = new PasswordResetService(ctx.dataSource, ctx.mailer, ctx.config.publicUrl);
  const router = Router();
  router.use(requireAdmin);

  router.get('/', async (_req, res) => {
    res.json({ users: await users.list() });
  });

  router.post('/invitations', validate(inviteInput), async (req, res) => {
    const { body } = inputOf(res, inviteInput);
    const invitation = await invitations.invite({
      email: body.email,
      name: body.name,
      isAdmin: body.isAdmin,
      project: body.projectId && body.role ? { id: body.projectId, role: body.role } : undefined,
      invitedBy: currentUser(req),
    });
    res.status(201).json({ invitation });
  });

  router.post('/:userId/deactivate', validate(userInput), async (req, res) => {
    res.json({ user: await users.deactivate(currentUser(req).id, inputOf(res, userInput).params.userId) });
  });

  router.post('/:userId/reactivate', validate(userInput), async (_req, res) => {
    res.json({ user: await users.reactivate(inputOf(res, userInput).params.userId) });
  });

  router.post('/:userId/password-reset', validate(userInput), async (_req, res) => {
    const { expiresAt } = await resets.requestForUser(inputOf(res, userInput).params.userId);
    res.status(202).json({ status: 'accepted', expiresAt });
  });

  return router;
}
