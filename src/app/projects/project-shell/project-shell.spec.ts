import { HttpTestingController } from '@angular/common/http/testing';
import { ProjectAction, ProjectRole } from '../../core/permissions';
import { ROLE_ACTIONS } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../project.testing';

const ALL_SECTIONS = ['Overview', 'Models', 'Shear results', 'Checks', '3D view', 'Findings', 'Members'];

describe('ProjectShell navigation', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  /** Opens a section as `role`, answering the project request with `permissions`. */
  async function openAs(
    role: ProjectRole,
    section: string,
    permissions: ProjectAction[] = ROLE_ACTIONS[role],
  ): Promise<HTMLElement> {
    const harness = await openProjectSection(role, section, { permissions });
    harness.detectChanges();
    return harness.fixture.nativeElement as HTMLElement;
  }

  // What a sighted user reads: icon ligature names are not part of the label.
  function label(element: Element): string {
    const copy = element.cloneNode(true) as Element;
    copy.querySelectorAll('mat-icon').forEach((icon) => icon.remove());
    return copy.textContent!.trim();
  }

  function sectionLinks(page: HTMLElement): string[] {
    return [...page.querySelectorAll('nav[aria-label="Project sections"] a')].map(label);
  }

  // Which actions each role finds inside a section is checked by that feature's own specs and the browser tests.
  it.each(['coordinator', 'engineer', 'reviewer'] as const)('shows every section to a %s, who may read them all', async (role) => {
    const page = await openAs(role, '');
    expect(sectionLinks(page)).toEqual(ALL_SECTIONS);
    expect(label(page.querySelector('a[aria-current="page"]')!)).toBe('Overview');
    expect(page.querySelector('.project-heading')?.textContent).toContain('Ferry terminal canopy');
  });

  it('hides a section whose permission the project answer leaves out', async () => {
    // A role that could read the project but not its models would not see the model sections.
    const page = await openAs('reviewer', '', ['project.read', 'check.read']);
    expect(sectionLinks(page)).toEqual(['Overview', 'Checks', 'Findings', 'Members']);
  });
});
