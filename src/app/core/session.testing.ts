// Sessions for client specs. Not imported by the app.
import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ProjectAction, ProjectRole } from './permissions';
import { Me, Session } from './session';

export const TEST_PROJECT_ID = '6f0c2a53-3c1e-4c8e-9a4f-2b1d7e5a9c10';

const EVERY_MEMBER: ProjectAction[] = ['project.read', 'model.read', 'check.read', 'finding.comment', 'export'];

/**
 * What each role may do in an active project, as the issue 2 API contract ("Roles and
 * permissions") specifies it; the server's server/auth/permissions.ts implements the same table.
 */
export const ROLE_ACTIONS: Readonly<Record<ProjectRole, ProjectAction[]>> = {
  coordinator: [
    ...EVERY_MEMBER,
    'project.edit',
    'project.archive',
    'members.manage',
    'model.upload',
    'results.upload',
    'matching.edit',
    'finding.assign',
    'finding.create',
  ],
  engineer: [...EVERY_MEMBER, 'check.run', 'finding.resolve', 'finding.create'],
  reviewer: [...EVERY_MEMBER, 'finding.verify', 'finding.accept', 'finding.assign'],
};

/** `GET /api/auth/me` for a member with `role` in the test project, or for a site admin with no membership. */
export function meFor(role: ProjectRole | 'admin', projectId = TEST_PROJECT_ID): Me {
  const isAdmin = role === 'admin';
  return {
    user: { id: `user-${role}`, email: `${role}@example.test`, name: `Test ${role}`, isAdmin },
    memberships: isAdmin ? [] : [{ projectId, projectName: 'Test project', role }],
    permissions: isAdmin ? {} : { [projectId]: ROLE_ACTIONS[role] },
    canCreateProjects: isAdmin || role === 'coordinator',
    devOutbox: false,
  };
}

/** Loads `me` into the Session as if the server had answered `GET /api/auth/me`. */
export async function signInForTest(me: Me): Promise<void> {
  const loading = TestBed.inject(Session).refresh();
  TestBed.inject(HttpTestingController).expectOne('/api/auth/me').flush(me);
  await loading;
}
