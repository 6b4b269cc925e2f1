import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { emailSchema } from '../users/user-fields';
import { MemberService } from './member.service';
import { PROJECT_ROLES } from './project-role';

const role = z.enum(PROJECT_ROLES, `must be one of ${PROJECT_ROLES.join(', ')}`);
const memberParams = z.object({ projectId: z.uuid(), userId: z.uuid('is not a valid user id') });
const listInput = { params: z.object({ projectId: z.uuid() }) };
const addInput = { params: listInput.params, body: z.object({ email: emailSchema, role }) };
const setRoleInput = { params: memberParams, body: z.object({ role }) };
const removeInput = { params: memberParams };

/** /api/projects/:projectId/members: who is in the project and with which role. */
export function membersRouter(ctx: AppContext): Router {
  const members = new MemberService(ctx.dataSource, ctx.mailer, ctx.config.publicUrl);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('project.read'), validate(listInput), async (_req, res) => {
    res.json({ members: await members.list(inputOf(res, listInput).params.projectId) });
  });

  router.post('/', requireProjectPermission('members.manage'), validate(addInput), async (req, res) => {
    const { params, body } = inputOf(res, addInput);
    res.status(201).json(await members.add(params.projectId, body.email, body.role, currentUser(req)));
  });

  router.put('/:userId', requireProjectPermission('members.manage'), validate(setRoleInput), async (_req, res) => {
    const { params, body } = inputOf(res, setRoleInput);
    res.json({ member: await members.setRole(params.projectId, params.userId, body.role) });
  });

  router.delete('/:userId', requireProjectPermission('members.manage'), validate(removeInput), async (_req, res) => {
    const { params } = inputOf(res, removeInput);
    await members.remove(params.projectId, params.userId);
    res.status(204).end();
  });

  return router;
}
