import { Router } from 'express';
import { currentUser, projectAccessOf, requireProjectPermission, requireSignedIn } from '../auth/require-access';
import type { AppContext } from '../http/app-context';
import { inputOf, validate } from '../http/validate';
import { createProjectBody, listProjectsQuery, projectIdParams, updateProjectBody } from './project-fields';
import { type ProjectDetail, ProjectService } from './project.service';

const listInput = { query: listProjectsQuery };
const createInput = { body: createProjectBody };
const projectInput = { params: projectIdParams };
const updateInput = { params: projectIdParams, body: updateProjectBody };

/** /api/projects: the project list, creation, settings and archiving. */
export function projectsRouter(ctx: AppContext): Router {
  const projects = new ProjectService(ctx.dataSource);
  const router = Router();

  router.get('/', requireSignedIn, validate(listInput), async (req, res) => {
    res.json({ projects: await projects.list(currentUser(req), inputOf(res, listInput).query.archived) });
  });

  router.post('/', requireSignedIn, validate(createInput), async (req, res) => {
    res.status(201).json({ project: await projects.create(currentUser(req), inputOf(res, createInput).body) });
  });

  router.get('/:projectId', requireProjectPermission('project.read'), validate(projectInput), async (_req, res) => {
    const access = projectAccessOf(res);
    const detail: ProjectDetail = {
      project: await projects.get(access.projectId, access.role),
      role: access.role,
      permissions: access.permissions,
    };
    res.json(detail);
  });

  router.patch('/:projectId', requireProjectPermission('project.edit'), validate(updateInput), async (_req, res) => {
    const access = projectAccessOf(res);
    res.json({ project: await projects.update(access.projectId, inputOf(res, updateInput).body, access.role) });
  });

  router.post('/:projectId/archive', requireProjectPermission('project.archive'), validate(projectInput), async (_req, res) => {
    const access = projectAccessOf(res);
    res.json({ project: await projects.setArchived(access.projectId, true, access.role) });
  });

  router.post('/:projectId/unarchive', requireProjectPermission('project.archive'), validate(projectInput), async (_req, res) => {
    const access = projectAccessOf(res);
    res.json({ project: await projects.setArchived(access.projectId, false, access.role) });
  });

  return router;
}
