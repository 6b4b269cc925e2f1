import { Router } from 'express';
import { type Action } from '../auth/permissions';
import { currentUser, projectAccessOf, requireProjectPermission } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { FindingNotifier } from '../notifications/finding-notifier';
import {
  bulkAssignInput,
  commentInput,
  createFindingInput,
  findingParams,
  listFindingsInput,
  transitionInput,
  updateFindingInput,
} from './finding-requests';
import { listenForFinishedRuns } from './finding-run-listener';
import { FindingService } from './finding.service';

/**
 * Every change to a finding needs at least what any member of an active project may do (comment); which change a
 * role may make (assign, resolve, verify, accept) the service checks against the workflow table.
 */
const TAKE_PART: Action = 'finding.comment';
const findingInput = { params: findingParams };

/**
 * /api/projects/:projectId/findings: the list, one finding, its status, comments and assignment. Also makes the
 * findings follow finished check runs.
 */
export function findingsRouter(ctx: AppContext): Router {
  const notifier = new FindingNotifier(ctx.dataSource, ctx.mailer, ctx.config.publicUrl, ctx.logger);
  const findings = new FindingService(ctx.dataSource, ctx.storage, notifier);
  // Built once per app, like the router, so the listener is registered once.
  listenForFinishedRuns(ctx, notifier);
  const router = Router({ mergeParams: true });

  router.get('/', requireProjectPermission('project.read'), validate(listFindingsInput), async (req, res) => {
    const { params, query } = inputOf(res, listFindingsInput);
    res.json(await findings.list(params.projectId, query, currentUser(req).id));
  });

  router.post('/', requireProjectPermission('finding.create'), validate(createFindingInput), async (req, res) => {
    const { params, body } = inputOf(res, createFindingInput);
    res.status(201).json({ finding: await findings.create(params.projectId, body, currentUser(req)) });
  });

  router.post('/bulk-assign', requireProjectPermission('finding.assign'), validate(bulkAssignInput), async (req, res) => {
    const { params, body } = inputOf(res, bulkAssignInput);
    res.json({ findings: await findings.bulkAssign(params.projectId, body.findingIds, body.assigneeId, currentUser(req)) });
  });

  router.get('/:findingId', requireProjectPermission('project.read'), validate(findingInput), async (_req, res) => {
    const { params } = inputOf(res, findingInput);
    res.json(await findings.detail(params.projectId, params.findingId, projectAccessOf(res)));
  });

  router.patch('/:findingId', requireProjectPermission(TAKE_PART), validate(updateFindingInput), async (req, res) => {
    const { params, body } = inputOf(res, updateFindingInput);
    res.json({ finding: await findings.update(params.projectId, params.findingId, body, projectAccessOf(res), currentUser(req)) });
  });

  router.post('/:findingId/transitions', requireProjectPermission(TAKE_PART), validate(transitionInput), async (req, res) => {
    const { params, body } = inputOf(res, transitionInput);
    res.json({ finding: await findings.transition(params.projectId, params.findingId, body, projectAccessOf(res), currentUser(req)) });
  });

  router.post('/:findingId/comments', requireProjectPermission('finding.comment'), validate(commentInput), async (req, res) => {
    const { params, body } = inputOf(res, commentInput);
    res.status(201).json({ comment: await findings.addComment(params.projectId, params.findingId, body.text, currentUser(req)) });
  });

  router.get('/:findingId/snapshot.png', requireProjectPermission('project.read'), validate(findingInput), async (_req, res) => {
    const { params } = inputOf(res, findingInput);
    const png = await findings.snapshot(params.projectId, params.findingId);
    res.type('image/png').send(png);
  });

  return router;
}
