import { rmSync } from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import type { AppContext } from '../http/app-context';
import { catalogueRouter } from './catalogue.router';
import { ModelMembersService } from './model-members.service';
import { ModelService } from './model.service';
import { modelsRouter } from './models.router';
import { ProjectCatalogueService } from './project-catalogue.service';

/**
 * /api/projects/:projectId/{models,catalogue}. Building it also fails the ingests a stopped server left unfinished:
 * the app is built once per start, before the server listens, so no upload of this run can be caught by it.
 */
export function modelFeatureRouter(ctx: AppContext): Router {
  const tmp = path.join(ctx.config.dataDir, 'tmp', 'models');
  // Whatever a stopped server left half-received or half-baked.
  rmSync(tmp, { recursive: true, force: true });
  const uploadDir = path.join(tmp, 'uploads');
  const models = new ModelService({ ...ctx, workDir: path.join(tmp, 'ingest') });
  void models.failInterrupted().catch((error: unknown) => ctx.logger.error({ err: error }, 'could not fail the interrupted ingests'));

  const router = Router({ mergeParams: true });
  router.use('/models', modelsRouter(models, new ModelMembersService(ctx.dataSource), { uploadDir, uploadLimitBytes: ctx.config.uploadLimitMb * 1024 ** 2 }));
  router.use('/catalogue', catalogueRouter(new ProjectCatalogueService(ctx.dataSource), { uploadDir }));
  return router;
}
