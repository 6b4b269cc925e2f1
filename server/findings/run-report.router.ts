import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { RunReportService } from './run-report.service';

const reportInput = { params: z.object({ projectId: z.uuid(), runId: z.uuid('is not a valid check run id') }) };

/** /api/projects/:projectId/checks/:runId/report.pdf: the PDF check report with findings and calculation sheets. */
export function runReportRouter(ctx: AppContext): Router {
  const reports = new RunReportService(ctx.dataSource);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('export'), validate(reportInput), async (req, res) => {
    const { params } = inputOf(res, reportInput);
    const report = await reports.pdf(params.projectId, params.runId, currentUser(req).name);
    res.attachment(report.fileName).type('application/pdf').send(report.body);
  });

  return router;
}
