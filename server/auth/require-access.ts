import type { Request, RequestHandler, Response } from 'express';
import type { DataSource } from 'typeorm';
import { contextOf } from '../http/app-context';
import { ConflictError, ForbiddenError, NotFoundError, UnauthenticatedError } from '../http/errors';
import { Project } from '../projects/project.entity';
import { ProjectMember } from '../projects/project-member.entity';
import { type Action, type ProjectAccess, allowedActions, blockedByArchive, roleGrants } from './permissions';
import type { SignedInUser } from './session-user';

/** The signed-in user of a request that passed requireSignedIn (or a stricter guard). */
export function currentUser(req: Request): SignedInUser {
  if (!req.user) throw new UnauthenticatedError();
  return req.user;
}

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  next(req.user ? undefined : new UnauthenticatedError());
};

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user) next(new UnauthenticatedError());
  else if (!req.user.isAdmin) next(new ForbiddenError('Only a site administrator can do this.'));
  else next();
};

export interface ResolvedProjectAccess extends ProjectAccess {
  projectId: string;
  permissions: Action[];
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * Guards a route under /projects/:projectId. Anonymous → 401; unknown project or no membership →
 * 404 (so outsiders cannot probe which projects exist); role without the action → 403; a change
 * to an archived project → 409. On success `projectAccessOf(res)` holds the caller's access.
 */
export function requireProjectPermission(action: Action): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw new UnauthenticatedError();
    const projectId = typeof req.params.projectId === 'string' ? req.params.projectId : '';
    const access = await findProjectAccess(contextOf(req).dataSource, req.user, projectId);
    if (!access) throw new NotFoundError('Project not found.', { code: 'project_not_found' });
    if (!roleGrants(access, action)) {
      throw new ForbiddenError(`Your role in this project (${access.role}) does not allow this (${action}).`);
    }
    if (blockedByArchive(access, action)) {
      throw new ConflictError('This project is archived. Unarchive it before making changes.', { code: 'project_archived' });
    }
    res.locals.projectAccess = { ...access, projectId, permissions: allowedActions(access) } satisfies ResolvedProjectAccess;
    next();
  };
}

export function projectAccessOf(res: Response): ResolvedProjectAccess {
  return res.locals.projectAccess as ResolvedProjectAccess;
}

/** The user's access to one project, or null when it does not exist or they are not a member. */
export async function findProjectAccess(
  dataSource: DataSource,
  user: Pick<SignedInUser, 'id' | 'isAdmin'>,
  projectId: string,
): Promise<ProjectAccess | null> {
  if (!UUID.test(projectId)) return null;
  const project = await dataSource.getRepository(Project).findOne({ where: { id: projectId }, select: { id: true, archived: true } });
  if (!project) return null;
  const member = await dataSource.getRepository(ProjectMember).findOneBy({ projectId, userId: user.id });
  if (!member && !user.isAdmin) return null;
  return { role: member?.role ?? null, isAdmin: user.isAdmin, archived: project.archived };
}
