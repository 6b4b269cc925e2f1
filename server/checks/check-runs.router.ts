import { Router } from 'express';
import { z } from 'zod';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import { STANDARDS } from '../engine/check';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { ResultMatchingService } from '../results/result-matching.service';
import { RESULT_STATUSES } from './checks-api-types';
import { CheckRunService } from './check-run.service';
import { finishedRun, memberSheet } from './check-results.query';
import { toRunView } from './check-run-view';
import { runMembersCsv } from './run-members-csv';
import { RUN_MEMBER_SORTS, RunMembersQueries } from './run-members.query';

const projectParams = z.object({ projectId: z.uuid() });
const runParams = z.object({ projectId: z.uuid(), runId: z.uuid('is not a valid check run id') });
const ratio = z.coerce.number().min(0).max(100);
const filter = z.object({
  status: z.enum(RESULT_STATUSES).optional(),
  storey: z.string().trim().min(1).max(200).optional(),
  profile: z.string().trim().min(1).max(200).optional(),
  minUtil: ratio.optional(),
  maxUtil: ratio.optional(),
  q: z.string().trim().max(200).optional(),
  sort: z.enum(RUN_MEMBER_SORTS).default('utilisation'),
  dir: z.enum(['asc', 'desc']).default('desc'),
});

const listInput = { params: projectParams };
const runInput = { params: runParams };
const startInput = {
  params: projectParams,
  body: z.strictObject({
    modelRevisionId: z.uuid('is not a valid revision id'),
    resultSetId: z.uuid('is not a valid result set id'),
    standard: z.enum(STANDARDS, `must be one of ${STANDARDS.join(', ')}`),
    parameters: z.record(z.string(), z.unknown()).default({}),
    confirmPoorMatch: z.boolean().optional(),
  }),
};
const membersInput = {
  params: runParams,
  query: filter.extend({ page: z.coerce.number().int().min(0).max(1_000_000).default(0), pageSize: z.coerce.number().int().min(1).max(500).default(50) }),
};
const csvInput = { params: runParams, query: filter };
const sheetInput = { params: runParams.extend({ globalId: z.string().min(1).max(64) }) };

/** /api/projects/:projectId/checks: check runs, their results table, colours for the 3D view and calculation sheets. */
export function checkRunsRouter(ctx: AppContext): Router {
  const runs = new CheckRunService({
    dataSource: ctx.dataSource,
    storage: ctx.storage,
    jobs: ctx.jobs,
    events: ctx.events,
    logger: ctx.logger,
    matching: ResultMatchingService.of(ctx.dataSource),
  });
  runs.failInterruptedRuns().catch((error: unknown) => ctx.logger.error({ err: error }, 'could not close interrupted check runs'));
  const members = new RunMembersQueries(ctx.dataSource);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('check.read'), validate(listInput), async (_req, res) => {
    res.json({ runs: await runs.list(projectAccessOf(res).projectId) });
  });

  router.post('/', requireProjectPermission('check.run'), validate(startInput), async (req, res) => {
    const { params, body } = inputOf(res, startInput);
    const user = currentUser(req);
    const { run } = await runs.start(params.projectId, { id: user.id, name: user.name }, body);
    res.status(202).json({ run });
  });

  router.get('/latest', requireProjectPermission('check.read'), validate(listInput), async (_req, res) => {
    res.json({ run: await runs.latest(projectAccessOf(res).projectId) });
  });

  router.get('/:runId', requireProjectPermission('check.read'), validate(runInput), async (_req, res) => {
    const { params } = inputOf(res, runInput);
    res.json({ run: await runs.get(params.projectId, params.runId) });
  });

  router.get('/:runId/members', requireProjectPermission('check.read'), validate(membersInput), async (_req, res) => {
    const { params, query } = inputOf(res, membersInput);
    await finishedRun(ctx.dataSource, params.projectId, params.runId);
    res.json(await members.page(params.runId, query));
  });

  router.get('/:runId/members.csv', requireProjectPermission('check.read'), validate(csvInput), async (_req, res) => {
    const { params, query } = inputOf(res, csvInput);
    const run = await finishedRun(ctx.dataSource, params.projectId, params.runId);
    const csv = runMembersCsv(toRunView(run, undefined), await members.all(params.runId, query));
    res.type('text/csv; charset=utf-8').attachment(`check-run-${run.id}.csv`).send(csv);
  });

  router.get('/:runId/colours', requireProjectPermission('check.read'), validate(runInput), async (_req, res) => {
    const { params } = inputOf(res, runInput);
    await finishedRun(ctx.dataSource, params.projectId, params.runId);
    res.type('application/json').send(await members.coloursJson(params.runId));
  });

  router.get('/:runId/members/:globalId/sheet', requireProjectPermission('check.read'), validate(sheetInput), async (_req, res) => {
    const { params } = inputOf(res, sheetInput);
    res.json(await memberSheet(ctx, params.projectId, params.runId, params.globalId));
  });

  return router;
}
