import { HttpTestingController } from '@angular/common/http/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { meFor, ROLE_ACTIONS, TEST_PROJECT_ID } from '../../core/session.testing';
import { Member } from '../project';
import { configureProjectPagesForTests, openProjectSection, TEST_PROJECT } from '../project.testing';

const project = TEST_PROJECT;
const members: Member[] = [
  { userId: 'user-coordinator', email: 'coordinator@example.test', name: 'Test coordinator', role: 'coordinator' },
  { userId: 'user-engineer', email: 'engineer@example.test', name: 'Test engineer', role: 'engineer' },
];
const membersUrl = `/api/projects/${TEST_PROJECT_ID}/members`;

describe('ProjectMembers', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'members');
    (await nextRequest(backend, membersUrl)).flush({ members });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-project-members')!;
  }

  async function answerAfterToken(match: { method: string; url: string }, body: object, status = 200) {
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const request = await nextRequest(backend, match);
    request.flush(body, { status, statusText: String(status) });
    return request.request.body;
  }

  async function reloadsAfterWrite(): Promise<void> {
    (await nextRequest(backend, membersUrl)).flush({ members });
    (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}`)).flush({
      project,
      role: 'coordinator',
      permissions: ROLE_ACTIONS.coordinator,
    });
    (await nextRequest(backend, '/api/auth/me')).flush(meFor('coordinator'));
    await settle();
  }

  it('lists members read-only for an engineer', async () => {
    const page = await open('engineer');
    expect([...page.querySelectorAll('tbody tr')].map((row) => row.querySelector('td')!.textContent!.trim())).toEqual([
      'Test coordinator',
      'Test engineer (you)',
    ]);
    expect(page.querySelector('form')).toBeNull();
    expect(page.querySelector('mat-select')).toBeNull();
    expect(page.textContent).toContain('Engineer');
  });

  it('lets a coordinator add someone by e-mail, which sends an invitation without saying whether they have an account', async () => {
    const page = await open('coordinator');
    const email = page.querySelector<HTMLInputElement>('input[type=email]')!;
    email.value = 'newcomer@example.test';
    email.dispatchEvent(new Event('input'));
    page.querySelector<HTMLButtonElement>('form button[type=submit]')!.click();
    const sent = await answerAfterToken(
      { method: 'POST', url: membersUrl },
      { invitation: { id: 'i1', email: 'newcomer@example.test', expiresAt: '2026-03-09T08:00:00Z' } },
      201,
    );
    expect(sent).toEqual({ email: 'newcomer@example.test', role: 'engineer' });
    await reloadsAfterWrite();
    expect(page.querySelector('[role=status]')?.textContent).toContain(
      'An invitation was sent to newcomer@example.test. They join as engineer once they accept it.',
    );
  });

  it("shows the server's refusal to remove the last coordinator", async () => {
    const page = await open('coordinator');
    page.querySelector<HTMLButtonElement>('button[aria-label="Remove Test coordinator"]')!.click();
    await settle();
    [...document.querySelectorAll<HTMLButtonElement>('mat-dialog-actions button')].find((b) => b.textContent?.trim() === 'Remove')!.click();
    await answerAfterToken(
      { method: 'DELETE', url: `${membersUrl}/user-coordinator` },
      { error: { code: 'last_coordinator', message: 'A project needs at least one coordinator.' } },
      409,
    );
    (await nextRequest(backend, membersUrl)).flush({ members });
    await settle();
    expect(page.querySelector('[role=alert]')?.textContent).toContain('A project needs at least one coordinator.');
  });
});
