import { Router } from 'express';
import { z } from 'zod';
import { isIfcGlobalId } from './bcf/bcf-guid';
import { currentUser, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { cameraSchema, clippingPlaneSchema, projectParams } from './finding-requests';
import { toSavedViewpointView } from './finding-views';
import { SavedViewpoint } from './saved-viewpoint.entity';

const globalIds = z.array(z.string().refine(isIfcGlobalId, 'is not a 22-character IFC GlobalId')).max(50_000);
const listInput = { params: projectParams };
const createInput = {
  params: projectParams,
  body: z.strictObject({
    name: z.string().trim().min(1, 'is required').max(120, 'is too long (at most 120 characters)'),
    camera: cameraSchema,
    visibleGlobalIds: globalIds.nullable().default(null),
    selectedGlobalIds: globalIds.default([]),
    sectionPlane: clippingPlaneSchema.nullable().default(null),
  }),
};

/** /api/projects/:projectId/viewpoints: named views of the model that the 3D view saves and reopens. */
export function savedViewpointsRouter(ctx: AppContext): Router {
  const viewpoints = ctx.dataSource.getRepository(SavedViewpoint);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('project.read'), validate(listInput), async (_req, res) => {
    const { projectId } = inputOf(res, listInput).params;
    const rows = await viewpoints.find({ where: { projectId }, order: { createdAt: 'DESC', name: 'ASC' } });
    res.json({ viewpoints: rows.map(toSavedViewpointView) });
  });

  // Saving a view is part of raising findings from the 3D view.
  router.post('/', requireProjectPermission('finding.create'), validate(createInput), async (req, res) => {
    const { params, body } = inputOf(res, createInput);
    const saved = await viewpoints.save(viewpoints.create({ ...body, projectId: params.projectId, createdById: currentUser(req).id }));
    res.status(201).json({ viewpoint: toSavedViewpointView(saved) });
  });

  return router;
}
