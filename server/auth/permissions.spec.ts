import type { ProjectRole } from '../projects/project-role';
import { ACTIONS, type Action, allowedActions, can, canCreateProjects } from './permissions';

// The matrix as the product brief states it (issue 2, "Roles and permissions"), written out
// literally so the table in permissions.ts is checked against the brief, not against itself.
const EXPECTED: Record<ProjectRole, Action[]> = {
  coordinator: [
    'project.read', 'model.read', 'check.read', 'finding.comment', 'export',
    'project.edit', 'project.archive', 'members.manage', 'model.upload', 'results.upload', 'matching.edit',
    'finding.assign', 'finding.create',
  ],
  engineer: ['project.read', 'model.read', 'check.read', 'finding.comment', 'export', 'check.run', 'finding.resolve', 'finding.create'],
  reviewer: ['project.read', 'model.read', 'check.read', 'finding.comment', 'export', 'finding.verify', 'finding.accept', 'finding.assign'],
};

describe('project permissions', () => {
  it.each(Object.entries(EXPECTED) as [ProjectRole, Action[]][])('lets a %s do exactly what the brief lists', (role, actions) => {
    const open = { role, isAdmin: false, archived: false };
    for (const action of ACTIONS) {
      expect({ action, allowed: can(open, action) }).toEqual({ action, allowed: actions.includes(action) });
    }
  });

  it('lets a site admin do everything, member or not', () => {
    expect(allowedActions({ role: null, isAdmin: true, archived: false })).toEqual([...ACTIONS]);
    expect(allowedActions({ role: 'reviewer', isAdmin: true, archived: false })).toEqual([...ACTIONS]);
  });

  it('lets nobody without a role or admin flag do anything', () => {
    expect(allowedActions({ role: null, isAdmin: false, archived: false })).toEqual([]);
  });

  it('keeps an archived project to reading, exporting and unarchiving', () => {
    expect(allowedActions({ role: 'coordinator', isAdmin: false, archived: true })).toEqual([
      'project.read', 'project.archive', 'model.read', 'check.read', 'export',
    ]);
    expect(allowedActions({ role: 'engineer', isAdmin: false, archived: true })).toEqual(['project.read', 'model.read', 'check.read', 'export']);
    expect(can({ role: null, isAdmin: true, archived: true }, 'model.upload')).toBe(false);
  });

  it('lets admins and coordinators of any project create projects', () => {
    expect(canCreateProjects({ isAdmin: true }, [])).toBe(true);
    expect(canCreateProjects({ isAdmin: false }, ['reviewer', 'coordinator'])).toBe(true);
    expect(canCreateProjects({ isAdmin: false }, ['engineer', 'reviewer'])).toBe(false);
    expect(canCreateProjects({ isAdmin: false }, [])).toBe(false);
  });
});
