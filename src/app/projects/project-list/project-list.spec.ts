import { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { meFor, signInForTest, TEST_PROJECT_ID } from '../../core/session.testing';
import { Project } from '../project';
import { ProjectList } from './project-list';

@Component({ template: 'project page' })
class ProjectPage {}

const active: Project = {
  id: TEST_PROJECT_ID,
  name: 'Ferry terminal canopy',
  code: 'FTC-2',
  description: '',
  client: 'Port authority',
  location: 'Pier 2',
  standard: 'aisc360-22-asd',
  archived: false,
  createdAt: '2026-03-02T08:00:00Z',
  role: 'reviewer',
};
const archived: Project = { ...active, id: 'p-old', name: 'Old footbridge', code: 'OFB-1', archived: true };

describe('ProjectList', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'projects', component: ProjectList },
          { path: 'projects/:projectId', component: ProjectPage },
        ]),
        ...provideApiForTests(),
      ],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function open(role: 'admin' | 'coordinator' | 'reviewer', projects: Project[]) {
    await signInForTest(meFor(role));
    const harness = await RouterTestingHarness.create('/projects');
    (await nextRequest(backend, (r) => r.url === '/api/projects' && r.params.get('archived') === 'false')).flush({ projects });
    await settle();
    return { harness, page: harness.routeNativeElement! };
  }

  function newProjectButton(page: HTMLElement): HTMLButtonElement | undefined {
    return [...page.querySelectorAll('button')].find((button) => button.textContent?.includes('New project'));
  }

  it('lists each project with its code, standard and the role of the user', async () => {
    const { page } = await open('reviewer', [active]);
    const tile = page.querySelector('.project-tile')!;
    expect(tile.querySelector('a')?.getAttribute('href')).toBe(`/projects/${TEST_PROJECT_ID}`);
    expect(tile.textContent).toContain('FTC-2');
    expect(tile.textContent).toContain('AISC 360-22, ASD');
    expect(tile.textContent).toContain('Reviewer');
  });

  it('offers a new project to those allowed to create one', async () => {
    expect(newProjectButton((await open('coordinator', [active])).page)).toBeDefined();
  });

  it('does not offer a new project to a reviewer', async () => {
    const { page } = await open('reviewer', []);
    expect(newProjectButton(page)).toBeUndefined();
    expect(page.textContent).toContain('A coordinator can add you');
  });

  it('brings archived projects into the list, marked, when asked', async () => {
    const { harness, page } = await open('admin', [active]);
    page.querySelector<HTMLButtonElement>('mat-slide-toggle button')!.click();
    (await nextRequest(backend, (r) => r.url === '/api/projects' && r.params.get('archived') === 'all')).flush({
      projects: [active, archived],
    });
    await harness.fixture.whenStable();
    const tiles = [...page.querySelectorAll('.project-tile')];
    expect(tiles).toHaveLength(2);
    expect(tiles[1].classList).toContain('archived');
    expect(tiles[1].textContent).toContain('Archived');
  });

  it('says why the list could not load', async () => {
    await signInForTest(meFor('engineer'));
    const harness = await RouterTestingHarness.create('/projects');
    (await nextRequest(backend, (r) => r.url === '/api/projects')).flush(
      { error: { code: 'internal', message: 'The server could not read the projects.' } },
      { status: 500, statusText: 'Server Error' },
    );
    await harness.fixture.whenStable();
    expect(harness.routeNativeElement!.querySelector('[role=alert]')?.textContent).toContain('could not read the projects');
  });
});
