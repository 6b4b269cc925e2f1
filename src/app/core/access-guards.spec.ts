import { HttpTestingController } from '@angular/common/http/testing';
import { Location } from '@angular/common';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter, Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { adminGuard, NOT_FOUND_PATH, projectPermissionGuard, signedInGuard } from './access-guards';
import { nextRequest, provideApiForTests } from './http.testing';
import { Me, Session } from './session';
import { meFor, TEST_PROJECT_ID } from './session.testing';

@Component({ template: '<p id="page">{{ "members" }}</p>' })
class MembersPage {}

@Component({ template: '<p id="page">not found</p>' })
class NotFoundPage {}

@Component({ template: '<p id="page">page</p>' })
class AnyPage {}

describe('route guards', () => {
  let backend: HttpTestingController;
  let harness: RouterTestingHarness;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'sign-in', component: AnyPage },
          { path: 'projects', component: AnyPage, canActivate: [signedInGuard] },
          { path: 'admin/users', component: AnyPage, canActivate: [adminGuard] },
          {
            path: 'projects/:projectId',
            canActivate: [projectPermissionGuard('project.read')],
            children: [
              { path: '', component: AnyPage },
              { path: 'members', component: MembersPage, canActivate: [projectPermissionGuard('members.manage')] },
            ],
          },
          { path: NOT_FOUND_PATH.slice(1), component: NotFoundPage },
        ]),
        ...provideApiForTests(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    harness = await RouterTestingHarness.create();
  });

  afterEach(() => backend.verify());

  async function signedInAs(me: Me | null): Promise<void> {
    const loading = TestBed.inject(Session).refresh();
    const request = backend.expectOne('/api/auth/me');
    if (me) request.flush(me);
    else request.flush({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401, statusText: 'Unauthorized' });
    await loading;
  }

  /** Where the browser's address bar points, and which page the router shows. */
  async function open(url: string): Promise<{ url: string; page: string | undefined }> {
    await harness.navigateByUrl(url);
    return {
      url: TestBed.inject(Location).path(),
      page: harness.routeNativeElement?.querySelector('#page')?.textContent ?? undefined,
    };
  }

  it('sends an anonymous visitor to sign in and back', async () => {
    await signedInAs(null);
    expect((await open('/projects')).url).toBe('/sign-in?returnUrl=%2Fprojects');
    expect(TestBed.inject(Router).url).toBe('/sign-in?returnUrl=%2Fprojects');
  });

  it('asks the server who is signed in when nothing is known yet', async () => {
    const opening = harness.navigateByUrl('/projects');
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('reviewer'));
    await opening;
    expect(TestBed.inject(Router).url).toBe('/projects');
  });

  it('keeps non-admins out of user admin without changing the address', async () => {
    await signedInAs(meFor('coordinator'));
    expect(await open('/admin/users')).toEqual({ url: '/admin/users', page: 'not found' });
  });

  it('lets a site admin into user admin', async () => {
    await signedInAs(meFor('admin'));
    expect(await open('/admin/users')).toEqual({ url: '/admin/users', page: 'page' });
  });

  it('opens a project section only for a role with that permission', async () => {
    await signedInAs(meFor('coordinator'));
    expect((await open(`/projects/${TEST_PROJECT_ID}/members`)).page).toBe('members');
  });

  it.each(['engineer', 'reviewer'] as const)('shows "not found" to a %s opening a coordinator-only section', async (role) => {
    await signedInAs(meFor(role));
    expect((await open(`/projects/${TEST_PROJECT_ID}`)).page).toBe('page');
    expect(await open(`/projects/${TEST_PROJECT_ID}/members`)).toEqual({
      url: `/projects/${TEST_PROJECT_ID}/members`,
      page: 'not found',
    });
  });

  it('asks again about a project the session has not heard of, then refuses it', async () => {
    await signedInAs(meFor('engineer'));
    const opening = harness.navigateByUrl('/projects/someone-elses-project');
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('engineer'));
    await opening;
    expect(harness.routeNativeElement?.querySelector('#page')?.textContent).toBe('not found');
  });

  it('finds a membership granted since the session was loaded', async () => {
    await signedInAs(meFor('engineer'));
    const opening = harness.navigateByUrl('/projects/new-project');
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('reviewer', 'new-project'));
    await opening;
    expect(TestBed.inject(Router).url).toBe('/projects/new-project');
  });
});
