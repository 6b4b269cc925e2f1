// Project pages for client specs. Not imported by the app.
import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding, withRouterConfig } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { nextRequest, provideApiForTests, settle } from '../core/http.testing';
import { ProjectAction, ProjectRole } from '../core/permissions';
import { meFor, ROLE_ACTIONS, signInForTest, TEST_PROJECT_ID } from '../core/session.testing';
import { Project } from './project';
import { projectRoutes } from './project-routes';
import { ProjectShell } from './project-shell/project-shell';

export const TEST_PROJECT: Project = {
  id: TEST_PROJECT_ID,
  name: 'Ferry terminal canopy',
  code: 'FTC-2',
  description: 'Cantilevered canopy on tapered welded girders.',
  client: 'Port authority',
  location: 'Pier 2',
  standard: 'en1993-1-1',
  settings: { defaultGrade: 'S355', gammaM0: 1, gammaM1: 1, eta: 1.2, warningBand: 0.9 },
  archived: false,
  createdAt: '2026-03-02T08:00:00Z',
};

/** The project shell and its pages routed as in the app, over the app's HTTP stack. */
export function configureProjectPagesForTests(): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [
      provideRouter(
        [{ path: 'projects/:projectId', component: ProjectShell, children: projectRoutes }],
        withComponentInputBinding(),
        withRouterConfig({ paramsInheritanceStrategy: 'always' }),
      ),
      ...provideApiForTests(),
    ],
  });
  return TestBed.inject(HttpTestingController);
}

/**
 * Signs in as `role` and opens a section of the test project, answering the project request with
 * `permissions` (the role's own by default).
 */
export async function openProjectSection(
  role: ProjectRole,
  section: string,
  options: { permissions?: ProjectAction[]; project?: Project } = {},
): Promise<RouterTestingHarness> {
  const backend = TestBed.inject(HttpTestingController);
  await signInForTest(meFor(role));
  const harness = await RouterTestingHarness.create();
  const opening = harness.navigateByUrl(`/projects/${TEST_PROJECT_ID}${section ? `/${section}` : ''}`);
  (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}`)).flush({
    project: options.project ?? TEST_PROJECT,
    role,
    permissions: options.permissions ?? ROLE_ACTIONS[role],
  });
  await opening;
  await settle();
  return harness;
}
