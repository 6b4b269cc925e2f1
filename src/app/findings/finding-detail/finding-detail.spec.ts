import { HttpTestingController } from '@angular/common/http/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { FindingDetail as Detail } from '../finding';
import { TEST_MEMBERS, testDetail, testFinding } from '../findings.testing';

const findingApi = `/api/projects/${TEST_PROJECT_ID}/findings/finding-1`;

describe('FindingDetail', () => {
  let backend: HttpTestingController;

  // The route loads the page lazily; transforming it and Material on first use can outlast a test's timeout.
  beforeAll(() => import('./finding-detail'), 60_000);

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole, detail: Detail): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'findings/finding-1');
    (await nextRequest(backend, findingApi)).flush(detail);
    (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}/members`)).flush({ members: TEST_MEMBERS });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-finding-detail')!;
  }

  const buttons = (page: HTMLElement) => [...page.querySelectorAll('.status-actions button')].map((button) => button.textContent!.trim());

  async function answerWrite(method: string, url: string, body: object): Promise<unknown> {
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const request = await nextRequest(backend, { method, url });
    request.flush(body);
    return request.request.body;
  }

  it('offers the status changes the server allows and links to the 3D view at the finding', async () => {
    const page = await open('engineer', testDetail({ allowedTransitions: ['in-progress', 'resolved'] }));
    expect(page.querySelector('h1')!.textContent!.replace(/\s+/g, ' ').trim()).toBe('F-0012 Web shear over capacity: G-101');
    expect(buttons(page)).toEqual(['construction Start work', 'task_alt Mark resolved']);
    expect(page.querySelector('.view-link')!.getAttribute('href')).toBe(`/projects/${TEST_PROJECT_ID}/3d-view?viewpoint=finding-1`);
    expect(page.querySelector('.history li')!.textContent!.replace(/\s+/g, ' ')).toContain('System raised the finding');
    expect(page.querySelector('tl-cautions-notice')).not.toBeNull();
    // Engineers do not assign.
    expect(page.querySelector<HTMLElement>('.triage mat-select')!.getAttribute('aria-disabled')).toBe('true');

  });

  it('asks what was done before a failing finding is marked resolved, and sends the note', async () => {
    const page = await open('engineer', testDetail({ allowedTransitions: ['in-progress', 'resolved'] }));
    page.querySelectorAll<HTMLButtonElement>('.status-actions button')[1].click();
    await settle();
    const dialog = document.querySelector<HTMLElement>('tl-status-note-dialog')!;
    expect(dialog.querySelector('h2')!.textContent).toContain('Mark F-0012 resolved?');
    expect(dialog.textContent).toContain('The member fails its check at 112.5 % utilisation.');
    dialog.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    await settle();
    expect(dialog.textContent).toContain('Write what was done about the failing member.');
    const text = dialog.querySelector<HTMLTextAreaElement>('textarea')!;
    text.value = ' Web plate 12 mm from revision 3. ';
    text.dispatchEvent(new Event('input'));
    dialog.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    const resolved = testFinding({ status: 'resolved' });
    expect(await answerWrite('POST', `${findingApi}/transitions`, { finding: resolved })).toEqual({ to: 'resolved', note: 'Web plate 12 mm from revision 3.' });
    (await nextRequest(backend, findingApi)).flush(testDetail({ finding: resolved }));
    await settle();
    expect(page.querySelector('[role=status]')!.textContent).toContain('F-0012 is now Resolved.');
  });

  it('resolves a finding raised by hand without asking, and names the way back from Resolved "Reopen"', async () => {
    const manual = testFinding({ kind: 'manual', utilisation: null });
    const page = await open('engineer', testDetail({ finding: manual, allowedTransitions: ['resolved'] }));
    page.querySelector<HTMLButtonElement>('.status-actions button')!.click();
    expect(await answerWrite('POST', `${findingApi}/transitions`, { finding: { ...manual, status: 'resolved' } })).toEqual({ to: 'resolved' });
    (await nextRequest(backend, findingApi)).flush(testDetail({ finding: { ...manual, status: 'resolved' }, allowedTransitions: ['in-progress', 'accepted'] }));
    await settle();
    expect(buttons(page)).toEqual(['undo Reopen', 'gavel Accept as is…']);
  });

  it("links a finding raised by a check run to the member's calculation sheet in that run", async () => {
    const page = await open('reviewer', testDetail());
    expect(page.querySelector('.sheet-link')!.getAttribute('href')).toBe(`/projects/${TEST_PROJECT_ID}/checks/run-1/members/2O2Fr$t4X7Zf8NOew3FLOH`);
  });

  it('links a finding raised by hand to no calculation sheet', async () => {
    const page = await open('reviewer', testDetail({ finding: testFinding({ kind: 'manual', runId: null }) }));
    expect(page.querySelector('.sheet-link')).toBeNull();
  });

  it('offers the project members matching what follows @ and writes the chosen one out as their address', async () => {
    const page = await open('engineer', testDetail());
    const box = page.querySelector<HTMLTextAreaElement>('.comment-form textarea')!;
    box.focus();
    box.value = 'Plate sizes agreed with @rev';
    box.dispatchEvent(new Event('input'));
    await settle();
    const options = [...document.querySelectorAll<HTMLElement>('mat-option')];
    expect(options.map((option) => option.textContent!.replace(/\s+/g, ' ').trim())).toEqual(['Test reviewer reviewer@example.test']);
    options[0].click();
    await settle();
    expect(box.value).toBe('Plate sizes agreed with @reviewer@example.test ');

    box.value = 'No mention here';
    box.dispatchEvent(new Event('input'));
    await settle();
    expect(document.querySelectorAll('mat-option')).toHaveLength(0);
  });

  it('shows the snapshot as the way into the 3D view when there is one', async () => {
    const page = await open('reviewer', testDetail({ finding: testFinding({ hasSnapshot: true, kind: 'manual' }) }));
    expect(page.querySelector('.view-link img')!.getAttribute('src')).toBe(`${findingApi}/snapshot.png`);
  });

  it('asks a reviewer for the justification before accepting, and sends it', async () => {
    const page = await open('reviewer', testDetail({ allowedTransitions: ['verified', 'open', 'accepted'] }));
    expect(buttons(page)).toEqual(['verified Verify', 'undo Reopen', 'gavel Accept as is…']);
    page.querySelectorAll<HTMLButtonElement>('.status-actions button')[2].click();
    await settle();
    const dialog = document.querySelector<HTMLElement>('tl-status-note-dialog')!;
    dialog.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    await settle();
    expect(dialog.textContent).toContain('Write why the finding may stay as it is.');
    const text = dialog.querySelector<HTMLTextAreaElement>('textarea')!;
    text.value = '  End plate to S-410 carries the shear.  ';
    text.dispatchEvent(new Event('input'));
    dialog.querySelector<HTMLButtonElement>('button[type=submit]')!.click();
    const accepted = testFinding({ status: 'accepted', justification: 'End plate to S-410 carries the shear.' });
    expect(await answerWrite('POST', `${findingApi}/transitions`, { finding: accepted })).toEqual({
      to: 'accepted',
      justification: 'End plate to S-410 carries the shear.',
    });
    (await nextRequest(backend, findingApi)).flush(testDetail({ finding: accepted }));
    await settle();
    expect(page.querySelector('.justification')!.textContent).toContain('End plate to S-410 carries the shear.');
  });

  it('lets a coordinator assign and set the priority, sending only what changed', async () => {
    const page = await open('coordinator', testDetail());
    page.querySelector<HTMLElement>('.triage mat-select')!.click();
    await settle();
    [...document.querySelectorAll<HTMLElement>('mat-option')].find((option) => option.textContent!.trim() === 'Test engineer')!.click();
    await settle();
    page.querySelector<HTMLButtonElement>('.triage button[type=submit]')!.click();
    expect(await answerWrite('PATCH', findingApi, { finding: testFinding() })).toEqual({ assigneeId: 'user-engineer' });
    (await nextRequest(backend, findingApi)).flush(testDetail());
    await settle();
  });

  it('posts a comment and clears the box', async () => {
    const page = await open('engineer', testDetail());
    const box = page.querySelector<HTMLTextAreaElement>('.comment-form textarea')!;
    box.value = '@reviewer@example.test the web plate is now 12 mm';
    box.dispatchEvent(new Event('input'));
    page.querySelector<HTMLButtonElement>('.comment-form button[type=submit]')!.click();
    const comment = { id: 'k1', guid: 'g', author: { id: 'user-engineer', name: 'Test engineer' }, text: box.value, createdAt: '2026-03-06T10:00:00Z' };
    expect(await answerWrite('POST', `${findingApi}/comments`, { comment })).toEqual({ text: '@reviewer@example.test the web plate is now 12 mm' });
    (await nextRequest(backend, findingApi)).flush(testDetail({ comments: [comment] }));
    await settle();
    expect(box.value).toBe('');
    expect(page.querySelector('.comments li')!.textContent).toContain('the web plate is now 12 mm');
  });
});
