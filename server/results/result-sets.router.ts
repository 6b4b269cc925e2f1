import { rmSync } from 'node:fs';
import path from 'node:path';
import { Router } from 'express';
import { z } from 'zod';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { columnMappingSchema } from './column-mapping';
import { ResultMatchingService } from './result-matching.service';
import { MATCHING_FILTERS } from './results-api-types';
import { ResultSetService } from './result-set.service';

const projectParams = z.object({ projectId: z.uuid() });
const resultSetParams = z.object({ projectId: z.uuid(), resultSetId: z.uuid('is not a valid result set id') });
const point = z.tuple([z.number(), z.number(), z.number()]);
const page = z.coerce.number().int().min(0).max(1_000_000).default(0);
const pageSize = z.coerce.number().int().min(1).max(500).default(50);

const listInput = { params: projectParams };
const getInput = { params: resultSetParams };
const importInput = {
  params: projectParams,
  body: z.strictObject({
    uploadId: z.uuid('is not a valid upload id'),
    sheet: z.string().trim().min(1).max(255).optional(),
    mapping: columnMappingSchema,
    modelRevisionId: z.uuid('is not a valid revision id'),
    name: z.string().trim().min(1, 'give the results a name').max(200),
    saveTemplateAs: z.string().trim().min(1).max(120).optional(),
    geometry: z.strictObject({ tolerance_mm: z.number().positive().max(10_000).optional(), scale: z.number().positive().optional(), offset_mm: point.optional() }).optional(),
  }),
};
const matchingInput = {
  params: resultSetParams,
  query: z.object({ modelRevisionId: z.uuid().optional(), filter: z.enum(MATCHING_FILTERS).default('all'), page, pageSize }),
};
const setMatchInput = {
  params: resultSetParams.extend({ resultKey: z.string().min(1).max(1000) }),
  query: z.object({ modelRevisionId: z.uuid().optional() }),
  body: z.strictObject({ globalId: z.string().trim().min(1).max(64).nullable() }),
};

/** /api/projects/:projectId/results: imported result sets, their matching to a revision and manual matches. */
export function resultSetsRouter(ctx: AppContext): Router {
  const workDir = path.join(ctx.config.dataDir, 'tmp', 'results-import');
  // Copies and half-written files a stopped server left; the app is built before it listens.
  rmSync(workDir, { recursive: true, force: true });
  const matching = ResultMatchingService.of(ctx.dataSource);
  const resultSets = new ResultSetService({ dataSource: ctx.dataSource, storage: ctx.storage, jobs: ctx.jobs, workDir, matching });
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('model.read'), validate(listInput), async (_req, res) => {
    res.json({ resultSets: await resultSets.list(projectAccessOf(res).projectId) });
  });

  router.post('/', requireProjectPermission('results.upload'), validate(importInput), async (req, res) => {
    const { params, body } = inputOf(res, importInput);
    res.status(201).json({ resultSet: await resultSets.importResults(params.projectId, currentUser(req).id, body) });
  });

  router.get('/:resultSetId', requireProjectPermission('model.read'), validate(getInput), async (_req, res) => {
    const { params } = inputOf(res, getInput);
    res.json({ resultSet: await resultSets.get(params.projectId, params.resultSetId) });
  });

  router.get('/:resultSetId/matching', requireProjectPermission('model.read'), validate(matchingInput), async (_req, res) => {
    const { params, query } = inputOf(res, matchingInput);
    res.json(await matching.page(params.projectId, params.resultSetId, { ...query, revisionId: query.modelRevisionId }));
  });

  router.put('/:resultSetId/matches/:resultKey', requireProjectPermission('matching.edit'), validate(setMatchInput), async (req, res) => {
    const { params, query, body } = inputOf(res, setMatchInput);
    res.json(await matching.setManualMatch(params.projectId, params.resultSetId, params.resultKey, body.globalId, currentUser(req).id, query.modelRevisionId));
  });

  return router;
}
