import { HttpEventType } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { RevisionView } from '../models-api';
import { revision } from '../models.testing';

const api = `/api/projects/${TEST_PROJECT_ID}`;

describe('RevisionList', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole, revisions: RevisionView[]): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'models');
    (await nextRequest(backend, `${api}/models`)).flush({ revisions });
    (await nextRequest(backend, `${api}/catalogue`)).flush({ sections: [] });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-revision-list')!;
  }

  function chooseFile(page: HTMLElement, file: File): void {
    const input = page.querySelector<HTMLInputElement>('tl-upload-revision input[type=file]')!;
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
  }

  const uploadButton = (page: HTMLElement) => [...page.querySelectorAll<HTMLButtonElement>('button')].find((b) => b.textContent!.includes('Upload revision'));

  it('lists revisions for an engineer, without the upload', async () => {
    const failed = revision({ id: 'rev-2', number: 2, fileName: 'no-units.ifc', status: 'failed', counts: null, error: 'The model could not be read (while opening the IFC file): no length unit.' });
    const page = await open('engineer', [failed, revision()]);
    expect(page.querySelector('tl-upload-revision')).toBeNull();
    const rows = [...page.querySelectorAll('table.revisions tbody tr')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Could not be read');
    expect(rows[0]).toContain('no length unit');
    expect(rows[1]).toContain('Ready');
    expect(rows[1]).toContain('4 members');
    expect(page.querySelector<HTMLAnchorElement>('a[href$="/models/rev-1"]')).not.toBeNull();
  });

  it('shows a revision being read with its phase, and asks again until it is ready', async () => {
    const reading = revision({ id: 'rev-2', number: 2, status: 'ingesting', progress: { phase: 'geometry', fraction: 0.62 }, counts: null });
    const page = await open('reviewer', [reading, revision()]);
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    expect(page.querySelector('[role=status]')!.textContent).toContain('Building the 3D geometry · 62 %');

    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [{ ...reading, status: 'ready', progress: null, counts: revision().counts }, revision()] });
    await settle();
    expect(page.querySelector('mat-progress-bar')).toBeNull();
    await new Promise((resolve) => setTimeout(resolve, 800));
    backend.expectNone(`${api}/models`);
  });

  it('uploads a file with its note, showing how much was sent, then lists the new revision', async () => {
    const page = await open('coordinator', []);
    expect(uploadButton(page)!.disabled).toBe(true);
    chooseFile(page, new File(['ISO-10303-21;'], 'frame-rev-C.ifc'));
    const note = page.querySelector<HTMLInputElement>('tl-upload-revision input[matinput]')!;
    note.value = 'Issued for coordination';
    note.dispatchEvent(new Event('input'));
    await settle();
    uploadButton(page)!.click();

    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const upload = await nextRequest(backend, { method: 'POST', url: `${api}/models` });
    const body = upload.request.body as FormData;
    expect(body.get('note')).toBe('Issued for coordination');
    expect((body.get('file') as File).name).toBe('frame-rev-C.ifc');
    upload.event({ type: HttpEventType.UploadProgress, loaded: 50, total: 100 });
    await settle();
    expect(page.textContent).toContain('Sending the file · 50 %');

    const queued = revision({ fileName: 'frame-rev-C.ifc', status: 'queued', counts: null });
    upload.flush({ revision: queued }, { status: 202, statusText: 'Accepted' });
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [queued] });
    await settle();
    expect(page.querySelector('table.revisions tbody')!.textContent).toContain('Waiting to be read');
    // The list keeps asking while the revision waits.
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [revision({ fileName: 'frame-rev-C.ifc' })] });
  });

  it("shows the server's reason when it refuses the file", async () => {
    const page = await open('coordinator', []);
    chooseFile(page, new File(['hello'], 'notes.ifc'));
    await settle();
    uploadButton(page)!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: `${api}/models` })).flush(
      { error: { code: 'not_ifc', message: 'This is not an IFC file: an IFC (STEP) file starts with "ISO-10303-21;".', details: null } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(page.querySelector('[role=alert]')!.textContent).toContain('This is not an IFC file');
  });
});
