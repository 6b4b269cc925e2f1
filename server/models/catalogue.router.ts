import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireProjectPermission } from '../auth/require-access';
import { inputOf, validate } from '../http/validate';
import { receivedFile, receiveFile } from './model-upload';
import type { ProjectCatalogueService } from './project-catalogue.service';

const catalogueInput = { params: z.object({ projectId: z.uuid() }) };
const EXPECTED_FILE = 'a section catalogue CSV file (.csv)';
/** A catalogue holds at most a few thousand rows of seven columns. */
const CATALOGUE_LIMIT_BYTES = 2 * 1024 ** 2;

/** /api/projects/:projectId/catalogue: the project's own rolled sections, replaced by each CSV upload. */
export function catalogueRouter(catalogue: ProjectCatalogueService, options: { uploadDir: string }): Router {
  const router = Router({ mergeParams: true });
  const upload = receiveFile({
    dir: options.uploadDir,
    maxBytes: CATALOGUE_LIMIT_BYTES,
    extensions: ['.csv', '.txt'],
    expected: EXPECTED_FILE,
    refusedCode: 'not_csv',
  });

  router.get('/', requireProjectPermission('model.read'), validate(catalogueInput), async (_req, res) => {
    res.json({ sections: await catalogue.sectionsOf(inputOf(res, catalogueInput).params.projectId) });
  });

  router.post('/', requireProjectPermission('model.upload'), upload, validate(catalogueInput), async (req, res) => {
    const { params } = inputOf(res, catalogueInput);
    res.json(await catalogue.replace(params.projectId, currentUser(req).id, receivedFile(req, EXPECTED_FILE)));
  });

  return router;
}
