import { pipeline } from 'node:stream/promises';
import { Router } from 'express';
import { z } from 'zod';
import { currentUser, requireProjectPermission } from '../auth/require-access';
import { inputOf, validate } from '../http/validate';
import type { ModelMembersService } from './model-members.service';
import { modelMembersRouter } from './model-members.router';
import { checkIfcUpload, receivedFile, receiveFile } from './model-upload';
import type { ModelService } from './model.service';
import { isFinal, type RevisionEvent } from './revision-progress';

const projectParams = z.object({ projectId: z.uuid() });
const revisionParams = projectParams.extend({ revisionId: z.uuid('is not a valid revision id') });
const listInput = { params: projectParams };
const uploadInput = { params: projectParams, body: z.object({ note: z.string().trim().max(2000, 'must be at most 2000 characters').default('') }) };
const revisionInput = { params: revisionParams };
const compareInput = { params: projectParams, query: z.object({ from: z.uuid('is not a valid revision id'), to: z.uuid('is not a valid revision id') }) };

const EXPECTED_FILE = 'an IFC file (.ifc or .ifczip)';
/** SSE comment lines keep proxies from closing a quiet stream. */
const HEARTBEAT_MS = 15_000;

export interface ModelsRouterOptions {
  uploadDir: string;
  uploadLimitBytes: number;
}

/** /api/projects/:projectId/models: revisions (upload, list, progress, geometry), their members, and comparisons. */
export function modelsRouter(models: ModelService, members: ModelMembersService, options: ModelsRouterOptions): Router {
  const router = Router({ mergeParams: true });
  const canRead = requireProjectPermission('model.read');
  const upload = receiveFile({
    dir: options.uploadDir,
    maxBytes: options.uploadLimitBytes,
    extensions: ['.ifc', '.ifczip'],
    expected: EXPECTED_FILE,
    refusedCode: 'not_ifc',
  });

  router.get('/', canRead, validate(listInput), async (_req, res) => {
    res.json({ revisions: await models.list(inputOf(res, listInput).params.projectId) });
  });

  router.post('/', requireProjectPermission('model.upload'), upload, validate(uploadInput), async (req, res) => {
    const { params, body } = inputOf(res, uploadInput);
    const file = receivedFile(req, EXPECTED_FILE);
    const ifc = await checkIfcUpload(req, file, { dir: options.uploadDir, maxBytes: options.uploadLimitBytes });
    const { revision } = await models.accept(params.projectId, currentUser(req).id, ifc, body.note, true);
    res.status(202).json({ revision });
  });

  router.get('/compare', canRead, validate(compareInput), async (_req, res) => {
    const { params, query } = inputOf(res, compareInput);
    res.json(await members.compare(params.projectId, query.from, query.to));
  });

  router.get('/:revisionId', canRead, validate(revisionInput), async (_req, res) => {
    const { params } = inputOf(res, revisionInput);
    res.json({ revision: await models.get(params.projectId, params.revisionId) });
  });

  router.get('/:revisionId/events', canRead, validate(revisionInput), async (req, res) => {
    const { params } = inputOf(res, revisionInput);
    const pending: RevisionEvent[] = [];
    // Watch before reading, so a status reached in between is not missed.
    let send: (event: RevisionEvent) => void = (event) => pending.push(event);
    const unwatch = models.events.watch(params.revisionId, (event) => send(event));
    let revision;
    try {
      revision = await models.get(params.projectId, params.revisionId);
    } catch (error) {
      unwatch();
      throw error;
    }
    res.writeHead(200, { 'Content-Type': 'text/event-stream; charset=utf-8', 'Cache-Control': 'no-store', 'X-Accel-Buffering': 'no' });
    const heartbeat = setInterval(() => res.write(': still reading\n\n'), HEARTBEAT_MS);
    const close = () => {
      clearInterval(heartbeat);
      unwatch();
      res.end();
    };
    req.on('close', close);
    send = (event) => {
      if (res.writableEnded) return;
      res.write(`data: ${JSON.stringify(event)}\n\n`);
      if (isFinal(event.status)) close();
    };
    send({ status: revision.status, phase: revision.progress?.phase ?? null, fraction: revision.progress?.fraction ?? null, error: revision.error });
    for (const event of pending) send(event);
  });

  router.get('/:revisionId/geometry.glb', canRead, validate(revisionInput), async (_req, res) => {
    const { params } = inputOf(res, revisionInput);
    const { stream, sizeBytes } = await models.geometry(params.projectId, params.revisionId);
    res.setHeader('Content-Type', 'model/gltf-binary');
    res.setHeader('Content-Length', String(sizeBytes));
    // A revision's geometry never changes once baked.
    res.setHeader('Cache-Control', 'private, max-age=3600');
    await pipeline(stream, res);
  });

  router.use('/:revisionId/members', modelMembersRouter(members));

  return router;
}
