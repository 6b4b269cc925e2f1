// Client mirror of server/auth/permissions.ts: the action names the server checks. The client only
// hides what a role may not do; the server enforces it on every route.

export type ProjectRole = 'coordinator' | 'engineer' | 'reviewer';

export const PROJECT_ROLES: readonly ProjectRole[] = ['coordinator', 'engineer', 'reviewer'];

export const ROLE_LABELS: Readonly<Record<ProjectRole, string>> = {
  coordinator: 'Coordinator',
  engineer: 'Engineer',
  reviewer: 'Reviewer',
};

export type ProjectAction =
  | 'project.read'
  | 'project.edit'
  | 'project.archive'
  | 'members.manage'
  | 'model.upload'
  | 'model.read'
  | 'results.upload'
  | 'matching.edit'
  | 'check.run'
  | 'check.read'
  | 'finding.create'
  | 'finding.assign'
  | 'finding.resolve'
  | 'finding.verify'
  | 'finding.accept'
  | 'finding.comment'
  | 'export';
