import type { ProjectRole } from '../projects/project-role';

/** Everything a project member may be allowed to do. Later features check these exact strings. */
export const ACTIONS = [
  'project.read',
  'project.edit',
  'project.archive',
  'members.manage',
  'model.upload',
  'model.read',
  'results.upload',
  'matching.edit',
  'check.run',
  'check.read',
  'finding.create',
  'finding.assign',
  'finding.resolve',
  'finding.verify',
  'finding.accept',
  'finding.comment',
  'export',
] as const;
export type Action = (typeof ACTIONS)[number];

const EVERY_MEMBER: readonly Action[] = ['project.read', 'model.read', 'check.read', 'finding.comment', 'export'];

/** The one table of which project role may do what; a site admin may do everything. */
export const ROLE_PERMISSIONS: Readonly<Record<ProjectRole, ReadonlySet<Action>>> = {
  coordinator: new Set<Action>([
    ...EVERY_MEMBER,
    'project.edit',
    'project.archive',
    'members.manage',
    'model.upload',
    'results.upload',
    'matching.edit',
    'finding.assign',
    'finding.create',
  ]),
  engineer: new Set<Action>([...EVERY_MEMBER, 'check.run', 'finding.resolve', 'finding.create']),
  reviewer: new Set<Action>([...EVERY_MEMBER, 'finding.verify', 'finding.accept', 'finding.assign']),
};

/** An archived project is a read-only record: reading, exporting and unarchiving stay possible. */
const ALLOWED_WHEN_ARCHIVED: ReadonlySet<Action> = new Set<Action>([
  'project.read',
  'model.read',
  'check.read',
  'export',
  'project.archive',
]);

export interface ProjectAccess {
  /** Null when a site admin is not a member. */
  role: ProjectRole | null;
  isAdmin: boolean;
  archived: boolean;
}

/** Whether the role (or admin flag) grants the action, before the archived rule. */
export function roleGrants(access: Pick<ProjectAccess, 'role' | 'isAdmin'>, action: Action): boolean {
  return access.isAdmin || (access.role !== null && ROLE_PERMISSIONS[access.role].has(action));
}

export function blockedByArchive(access: Pick<ProjectAccess, 'archived'>, action: Action): boolean {
  return access.archived && !ALLOWED_WHEN_ARCHIVED.has(action);
}

export function can(access: ProjectAccess, action: Action): boolean {
  return roleGrants(access, action) && !blockedByArchive(access, action);
}

/** The actions the client may offer, in ACTIONS order. */
export function allowedActions(access: ProjectAccess): Action[] {
  return ACTIONS.filter((action) => can(access, action));
}

/** Admins, and anyone who coordinates at least one project, may create projects. */
export function canCreateProjects(user: { isAdmin: boolean }, roles: readonly ProjectRole[]): boolean {
  return user.isAdmin || roles.includes('coordinator');
}
