import { Router } from 'express';
import { z } from 'zod';
import { requireProjectPermission } from '../auth/require-access';
import { inputOf, validate } from '../http/validate';
import { memberListQuery } from './member-list-query';
import type { ModelMembersService } from './model-members.service';

const revisionParams = z.object({ projectId: z.uuid(), revisionId: z.uuid('is not a valid revision id') });
const listInput = { params: revisionParams, query: memberListQuery };
const revisionInput = { params: revisionParams };
const detailInput = { params: revisionParams.extend({ globalId: z.string().min(1).max(64) }) };

/** /api/projects/:projectId/models/:revisionId/members: the members table, its facets, every member's labels (for the 3D view) and one member's record. */
export function modelMembersRouter(members: ModelMembersService): Router {
  const router = Router({ mergeParams: true });
  const canRead = requireProjectPermission('model.read');

  router.get('/', canRead, validate(listInput), async (_req, res) => {
    const { params, query } = inputOf(res, listInput);
    res.json(await members.list(params.projectId, params.revisionId, query));
  });

  router.get('/facets', canRead, validate(revisionInput), async (_req, res) => {
    const { params } = inputOf(res, revisionInput);
    res.json(await members.facets(params.projectId, params.revisionId));
  });

  router.get('/labels', canRead, validate(revisionInput), async (_req, res) => {
    const { params } = inputOf(res, revisionInput);
    res.json(await members.labels(params.projectId, params.revisionId));
  });

  router.get('/:globalId', canRead, validate(detailInput), async (_req, res) => {
    const { params } = inputOf(res, detailInput);
    res.json({ member: await members.detail(params.projectId, params.revisionId, params.globalId) });
  });

  return router;
}
