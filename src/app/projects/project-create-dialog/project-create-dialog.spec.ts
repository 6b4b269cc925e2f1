import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { Project } from '../project';
import { ProjectCreateDialog } from './project-create-dialog';

describe('ProjectCreateDialog', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    TestBed.inject(MatDialog).closeAll();
    backend.verify();
  });

  async function openDialog() {
    const ref = TestBed.inject(MatDialog).open<ProjectCreateDialog, void, Project>(ProjectCreateDialog);
    const closed = firstValueFrom(ref.afterClosed());
    await settle();
    const root = document.querySelector<HTMLElement>('tl-project-create-dialog')!;
    const type = (label: string, value: string) => {
      const field = [...root.querySelectorAll('mat-form-field')].find((f) => f.querySelector('mat-label')?.textContent?.trim() === label)!;
      const input = field.querySelector<HTMLInputElement>('input, textarea')!;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    const submit = () => root.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    return { root, closed, type, submit };
  }

  it('creates the project and closes with it', async () => {
    const { closed, type, submit } = await openDialog();
    type('Project name', 'Harbour crane rail girders');
    type('Code', 'HCR-4');
    submit();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const create = await nextRequest(backend, { method: 'POST', url: '/api/projects' });
    expect(create.request.body).toMatchObject({ name: 'Harbour crane rail girders', code: 'HCR-4', standard: 'aisc360-22-lrfd' });
    create.flush({ project: { id: 'new-id', name: 'Harbour crane rail girders' } }, { status: 201, statusText: 'Created' });
    await expect(closed).resolves.toMatchObject({ id: 'new-id' });
  });

  it("stays open with the server's reason when the code is taken", async () => {
    const { root, type, submit } = await openDialog();
    type('Project name', 'Second canopy');
    type('Code', 'FTC-2');
    submit();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, '/api/projects')).flush(
      { error: { code: 'code_taken', message: 'Another project already uses the code FTC-2.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();
    expect(root.querySelector('[role=alert]')?.textContent).toContain('already uses the code FTC-2');
    expect(document.querySelector('tl-project-create-dialog')).not.toBeNull();
  });

  it('sends nothing without a name and code', async () => {
    const { submit } = await openDialog();
    submit();
    await settle();
    expect(backend.match(() => true)).toEqual([]);
  });
});
