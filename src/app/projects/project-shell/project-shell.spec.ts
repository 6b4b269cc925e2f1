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

  function buttons(page: HTMLElement): string[] {
    return [...page.querySelectorAll('tl-section-placeholder button')].map(label);
  }

  it.each(['coordinator', 'engineer', 'reviewer'] as const)('shows every section to a %s, who may read them all', async (role) => {
    const page = await openAs(role, 'checks');
    expect(sectionLinks(page)).toEqual(ALL_SECTIONS);
    expect(label(page.querySelector('a[aria-current="page"]')!)).toBe('Checks');
    expect(page.querySelector('.project-heading')?.textContent).toContain('Ferry terminal canopy');
  });

  it('offers the upload of a model revision to a coordinator only', async () => {
    expect(buttons(await openAs('coordinator', 'models'))).toEqual(['Upload IFC revision', 'Compare revisions']);
  });

  it.each(['engineer', 'reviewer'] as const)('does not offer a model upload to a %s', async (role) => {
    const actions = buttons(await openAs(role, 'models'));
    expect(actions).toEqual(['Compare revisions']);
  });

  it('offers starting a check to an engineer', async () => {
    expect(buttons(await openAs('engineer', 'checks'))).toEqual(['Start a check']);
  });

  it.each(['coordinator', 'reviewer'] as const)('does not offer starting a check to a %s', async (role) => {
    expect(buttons(await openAs(role, 'checks'))).toEqual([]);
  });

  it('offers verifying findings to a reviewer only', async () => {
    const actions = buttons(await openAs('reviewer', 'findings'));
    expect(actions).toContain('Verify findings');
    expect(actions).not.toContain('Create finding');
  });

  it('hides a section whose permission the project answer leaves out', async () => {
    // A role that could read the project but not its models would not see the model sections.
    const page = await openAs('reviewer', '', ['project.read', 'check.read']);
    expect(sectionLinks(page)).toEqual(['Overview', 'Checks', 'Findings', 'Members']);
  });

  it('follows the archived rule the server applied: no uploads in an archived project', async () => {
    const readOnly = ROLE_ACTIONS.coordinator.filter((action) =>
      ['project.read', 'model.read', 'check.read', 'export', 'project.archive'].includes(action),
    );
    expect(buttons(await openAs('coordinator', 'models', readOnly))).toEqual(['Compare revisions']);
  });
});
