import { type Response, Router } from 'express';
import multer from 'multer';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { ValidationError } from '../http/errors';
import { inputOf, validate } from '../http/validate';
import { FindingNotifier } from '../notifications/finding-notifier';
import { DEFAULT_ARCHIVE_LIMITS } from './bcf/bcf-archive-reader';
import { type ExportFile, FindingExchangeService } from './finding-exchange.service';
import { exportBcfInput, exportCsvInput, projectParams } from './finding-requests';

const importInput = { params: projectParams };

function sendFile(res: Response, file: ExportFile): void {
  res.attachment(file.fileName).type(file.contentType).send(file.body);
}

/**
 * /api/projects/:projectId/findings/export.* and /import: the findings as BCF and CSV, and BCF coming back.
 * Mounted before the findings router, whose /:findingId would otherwise take these names for ids.
 */
export function findingExportsRouter(ctx: AppContext): Router {
  const notifier = new FindingNotifier(ctx.dataSource, ctx.mailer, ctx.config.publicUrl, ctx.logger);
  const exchange = new FindingExchangeService(ctx.dataSource, ctx.storage, notifier);
  // The archive reader refuses larger files anyway; the limit stops them before they are held in memory. Browsers send
  // file names as raw UTF-8 without a charset, which busboy would read as latin1.
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: DEFAULT_ARCHIVE_LIMITS.maxArchiveBytes, files: 1 },
    defParamCharset: 'utf8',
  });
  const router = Router({ mergeParams: true });

  router.get('/export.bcfzip', requireProjectPermission('export'), validate(exportBcfInput), async (req, res) => {
    const { params, query } = inputOf(res, exportBcfInput);
    sendFile(res, await exchange.bcf(params.projectId, query, currentUser(req).id, query.version));
  });

  router.get('/export.csv', requireProjectPermission('export'), validate(exportCsvInput), async (req, res) => {
    const { params, query } = inputOf(res, exportCsvInput);
    sendFile(res, await exchange.csv(params.projectId, query, currentUser(req).id));
  });

  // Comments need any member's right to take part; each status change in the file is checked for the role.
  router.post('/import', requireProjectPermission('finding.comment'), validate(importInput), upload.single('file'), async (req, res) => {
    if (!req.file) throw new ValidationError('Choose a BCF file (.bcf or .bcfzip) to import.', { code: 'bcf_file_missing' });
    const { params } = inputOf(res, importInput);
    res.json({ import: await exchange.importBcf(params.projectId, req.file, projectAccessOf(res), currentUser(req)) });
  });

  return router;
}
