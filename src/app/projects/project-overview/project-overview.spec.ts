import { HttpTestingController } from '@angular/common/http/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectAction, ProjectRole } from '../../core/permissions';
import { meFor, ROLE_ACTIONS, TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection, TEST_PROJECT } from '../project.testing';

const project = TEST_PROJECT;

describe('ProjectOverview', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole, permissions: ProjectAction[] = ROLE_ACTIONS[role], shown = project) {
    const harness = await openProjectSection(role, '', { permissions, project: shown });
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-project-overview')!;
  }

  const buttonLabels = (page: HTMLElement) =>
    [...page.querySelectorAll('.header-actions button')].map((b) => b.textContent!.replace(/^\s*\w+\s+/, '').trim());

  it('shows the details and the cautions to every member', async () => {
    const page = await open('engineer');
    expect(page.textContent).toContain('EN 1993-1-1 with EN 1993-1-5');
    expect(page.textContent).toContain('Port authority');
    expect(page.querySelector('tl-cautions-notice')?.textContent).toContain('engineer of record');
    expect(buttonLabels(page)).toEqual([]);
  });

  it('lets a coordinator edit and archive', async () => {
    expect(buttonLabels(await open('coordinator'))).toEqual(['Edit details', 'Archive project']);
  });

  it('offers only restoring an archived project', async () => {
    // The server leaves project.edit out for archived projects (server/auth/permissions.ts).
    const readOnly: ProjectAction[] = ['project.read', 'model.read', 'check.read', 'export', 'project.archive'];
    const page = await open('coordinator', readOnly, { ...project, archived: true });
    expect(buttonLabels(page)).toEqual(['Restore project']);
    expect(page.textContent).toContain('Archived: a read-only record.');
  });

  it('saves edited details and shows the saved project', async () => {
    const page = await open('coordinator');
    page.querySelector<HTMLButtonElement>('.header-actions button')!.click();
    await settle();
    const name = page.querySelector<HTMLInputElement>('input[formcontrolname=name]')!;
    name.value = 'Ferry terminal canopy, east';
    name.dispatchEvent(new Event('input'));
    page.querySelector<HTMLButtonElement>('.edit-form button[type=submit]')!.click();

    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const patch = await nextRequest(backend, { method: 'PATCH', url: `/api/projects/${TEST_PROJECT_ID}` });
    expect(patch.request.body).toMatchObject({ name: 'Ferry terminal canopy, east', code: 'FTC-2' });
    const saved = { ...project, name: 'Ferry terminal canopy, east' };
    patch.flush({ project: saved });

    (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}`)).flush({ project: saved, role: 'coordinator', permissions: ROLE_ACTIONS.coordinator });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('coordinator'));
    await settle();
    expect(page.querySelector('h1')?.textContent).toBe('Ferry terminal canopy, east');
    expect(page.querySelector('.edit-form')).toBeNull();
  });

  describe('check defaults', () => {
    const values = (page: HTMLElement) =>
      [...page.querySelectorAll('tl-project-check-defaults dl div')].map((d) => [d.querySelector('dt')!.textContent!.trim(), d.querySelector('dd')!.textContent!.trim()]);
    const setField = (page: HTMLElement, name: string, value: string) => {
      const field = page.querySelector<HTMLInputElement>(`tl-project-check-defaults input[formcontrolname=${name}]`)!;
      field.value = value;
      field.dispatchEvent(new Event('input'));
    };

    it('shows every member the defaults of new check runs, with the EN factors for an EN project', async () => {
      const page = await open('engineer');
      expect(values(page)).toEqual([
        ['Default grade', 'S355'],
        ['γM0', '1.00'],
        ['γM1', '1.00'],
        ['η', '1.20'],
        ['Near the limit from', '90 %'],
      ]);
      expect(page.querySelector('tl-project-check-defaults button')).toBeNull();
    });

    it('leaves out the EN factors for an AISC project', async () => {
      const page = await open('engineer', ROLE_ACTIONS.engineer, { ...project, standard: 'aisc360-22-lrfd', settings: { ...project.settings, defaultGrade: 'A992' } });
      expect(values(page)).toEqual([
        ['Default grade', 'A992'],
        ['Near the limit from', '90 %'],
      ]);
    });

    it('lets a coordinator set national-annex factors, refusing values out of range', async () => {
      const page = await open('coordinator');
      page.querySelector<HTMLButtonElement>('tl-project-check-defaults button')!.click();
      await settle();
      setField(page, 'gammaM0', '1.6');
      page.querySelector<HTMLButtonElement>('tl-project-check-defaults button[type=submit]')!.click();
      await settle();
      // Nothing sent: γM0 above 1.5 is refused in the form, as the server would.
      backend.expectNone({ method: 'PATCH' });
      expect(page.querySelector('tl-project-check-defaults mat-error')?.textContent).toContain('Between 1 and 1.5');

      setField(page, 'gammaM0', '1.05');
      setField(page, 'gammaM1', '1.1');
      setField(page, 'warningPercent', '85');
      page.querySelector<HTMLButtonElement>('tl-project-check-defaults button[type=submit]')!.click();
      (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
      const patch = await nextRequest(backend, { method: 'PATCH', url: `/api/projects/${TEST_PROJECT_ID}` });
      expect(patch.request.body).toEqual({ settings: { defaultGrade: 'S355', warningBand: 0.85, gammaM0: 1.05, gammaM1: 1.1, eta: 1.2 } });
      const saved = { ...project, settings: { ...project.settings, gammaM0: 1.05, gammaM1: 1.1, warningBand: 0.85 } };
      patch.flush({ project: saved });
      (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}`)).flush({ project: saved, role: 'coordinator', permissions: ROLE_ACTIONS.coordinator });
      (await nextRequest(backend, '/api/auth/me')).flush(meFor('coordinator'));
      await settle();
      expect(values(page)).toContainEqual(['γM0', '1.05']);
      expect(values(page)).toContainEqual(['Near the limit from', '85 %']);
    });
  });
});
