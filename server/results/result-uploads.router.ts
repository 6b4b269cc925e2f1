import { rmSync } from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import { z } from 'zod';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { receivedFile, receiveFile } from '../models/model-upload';
import { ResultsUploadService } from './results-upload.service';

const EXPECTED = 'a results file (CSV or XLSX)';
/** Content decides the format (results-table.ts); the name only keeps out files that are plainly something else. */
const EXTENSIONS = ['.csv', '.tsv', '.tab', '.txt', '.xlsx', '.xls'];

const projectParams = z.object({ projectId: z.uuid() });
const uploadInput = { params: projectParams };
const previewInput = {
  params: z.object({ projectId: z.uuid(), uploadId: z.uuid('is not a valid upload id') }),
  query: z.object({ sheet: z.string().trim().min(1).max(255).optional() }),
};

/** /api/projects/:projectId/results/uploads: a results file received and previewed before its import. */
export function resultUploadsRouter(ctx: AppContext): Router {
  const tmp = path.join(ctx.config.dataDir, 'tmp', 'results-uploads');
  // Whatever a stopped server left half-received; the app is built before it listens, so no request is in flight.
  rmSync(tmp, { recursive: true, force: true });
  const uploads = new ResultsUploadService({ dataSource: ctx.dataSource, storage: ctx.storage, workDir: path.join(tmp, 'preview') });
  const receive = receiveFile({
    dir: path.join(tmp, 'received'),
    maxBytes: ctx.config.uploadLimitMb * 1024 * 1024,
    extensions: EXTENSIONS,
    expected: EXPECTED,
    refusedCode: 'not_results_file',
  });
  const router = Router({ mergeParams: true });

  router.post('/', requireProjectPermission('results.upload'), validate(uploadInput), receive, async (req, res) => {
    const file = receivedFile(req, EXPECTED);
    res.status(201).json({ upload: await uploads.upload(projectAccessOf(res).projectId, currentUser(req).id, file) });
  });

  router.get('/:uploadId/preview', requireProjectPermission('results.upload'), validate(previewInput), async (_req, res) => {
    const { params, query } = inputOf(res, previewInput);
    res.json({ upload: await uploads.preview(params.projectId, params.uploadId, query.sheet) });
  });

  return router;
}
