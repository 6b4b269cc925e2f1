import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { TEST_MEMBERS, testFinding } from '../findings.testing';

const findingsApi = `/api/projects/${TEST_PROJECT_ID}/findings`;
const rows = [testFinding(), testFinding({ id: 'finding-2', number: 13, title: 'Notch at B-7', kind: 'manual', status: 'resolved', utilisation: null, memberTag: null, labels: [] })];

describe('FindingsList', () => {
  let backend: HttpTestingController;

  // The route loads the page lazily; transforming it and Material's table on first use can outlast a test's timeout.
  beforeAll(() => import('./findings-list'), 60_000);

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  const listRequest = (): Promise<TestRequest> => nextRequest(backend, (request) => request.url === findingsApi && request.method === 'GET');
  const paramsOf = (request: TestRequest): Record<string, string> =>
    Object.fromEntries(request.request.params.keys().map((key) => [key, request.request.params.get(key)!]));

  async function open(role: ProjectRole, query = ''): Promise<HTMLElement> {
    const harness = await openProjectSection(role, `findings${query}`);
    (await nextRequest(backend, `/api/projects/${TEST_PROJECT_ID}/members`)).flush({ members: TEST_MEMBERS });
    (await listRequest()).flush({ total: 2, findings: rows });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-findings-list')!;
  }

  it('shows the findings with reference, status and utilisation, and the cautions', async () => {
    const page = await open('engineer');
    const cells = [...page.querySelectorAll('tbody tr')].map((row) => [...row.querySelectorAll('td')].map((td) => td.textContent!.replace(/\s+/g, ' ').trim()));
    expect(cells[0]).toEqual(['F-0012', 'Web shear over capacity: G-101CanopyWeb over capacity', 'G-101', 'Open', 'High', '—', '—', '112.5 %']);
    expect(cells[1].slice(0, 4)).toEqual(['F-0013', 'Notch at B-7Raised by hand', '2O2Fr$t4X7Zf8NOew3FLOH', 'Resolved']);
    expect(page.querySelector('a.finding-link')!.getAttribute('href')).toBe(`/projects/${TEST_PROJECT_ID}/findings/finding-1`);
    expect(page.querySelector('tl-cautions-notice')).not.toBeNull();
    // Engineers do not assign: no selection column.
    expect(page.querySelector('mat-checkbox')).toBeNull();
  });

  it('filters on the server and keeps the filters in the page address', async () => {
    const page = await open('reviewer', '?status=open,in-progress');
    const search = page.querySelector<HTMLInputElement>('input[type=search]')!;
    search.value = 'F-12';
    search.dispatchEvent(new Event('input'));
    const filtered = await listRequest();
    expect(paramsOf(filtered)).toEqual({ sort: 'number', dir: 'desc', page: '0', pageSize: '25', status: 'open,in-progress', q: 'F-12' });
    filtered.flush({ total: 1, findings: [rows[0]] });
    await settle();
    expect(TestBed.inject(Router).url).toBe(`/projects/${TEST_PROJECT_ID}/findings?status=open,in-progress&q=F-12`);
  });

  it('offers exports of exactly what the filters show', async () => {
    const page = await open('reviewer', '?assignee=me');
    page.querySelector<HTMLButtonElement>('.header-actions button')!.click();
    await settle();
    const links = [...document.querySelectorAll<HTMLAnchorElement>('a[mat-menu-item]')].map((a) => [a.textContent!.trim(), a.getAttribute('href')]);
    expect(links).toEqual([
      ['BCF 2.1', `${findingsApi}/export.bcfzip?assignee=me&version=2.1`],
      ['BCF 3.0', `${findingsApi}/export.bcfzip?assignee=me&version=3.0`],
      ['CSV', `${findingsApi}/export.csv?assignee=me`],
    ]);
  });

  it('lets a coordinator assign the selected findings at once', async () => {
    const page = await open('coordinator');
    const boxes = page.querySelectorAll<HTMLInputElement>('tbody mat-checkbox input');
    boxes[0].click();
    boxes[1].click();
    await settle();
    expect(page.querySelector('.bulk-bar')!.textContent).toContain('2 selected');
    page.querySelector<HTMLElement>('.bulk-bar mat-select')!.click();
    await settle();
    [...document.querySelectorAll<HTMLElement>('mat-option')].find((option) => option.textContent!.trim() === 'Test engineer')!.click();
    await settle();
    page.querySelector<HTMLButtonElement>('.bulk-bar button[mat-flat-button]')!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const assign = await nextRequest(backend, { method: 'POST', url: `${findingsApi}/bulk-assign` });
    expect(assign.request.body).toEqual({ findingIds: ['finding-1', 'finding-2'], assigneeId: 'user-engineer' });
    assign.flush({ findings: rows });
    (await listRequest()).flush({ total: 2, findings: rows });
    await settle();
    expect(page.querySelector('[role=status]')!.textContent).toContain('2 finding(s) assigned to Test engineer.');
    expect(page.querySelector('.bulk-bar')).toBeNull();
  });

  it('imports a BCF file and shows what it changed', async () => {
    const page = await open('engineer');
    const input = page.querySelector<HTMLInputElement>('input[type=file]')!;
    const file = new File(['PK'], 'returned.bcf', { type: 'application/octet-stream' });
    Object.defineProperty(input, 'files', { value: [file], configurable: true });
    input.dispatchEvent(new Event('change'));
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const upload = await nextRequest(backend, { method: 'POST', url: `${findingsApi}/import` });
    expect((upload.request.body as FormData).get('file')).toBeInstanceOf(File);
    upload.flush({ import: { version: '2.1', topics: 2, statusChanges: 1, commentsAdded: 3, unchanged: 1, warnings: ['An empty comment was left out.'] } });
    (await listRequest()).flush({ total: 2, findings: rows });
    await settle();
    const summary = page.querySelector('.import-summary')!.textContent!.replace(/\s+/g, ' ');
    expect(summary).toContain('BCF 2.1: 2 topic(s) read, 1 status change(s) and 3 new comment(s) applied, 1 unchanged.');
    expect(summary).toContain('An empty comment was left out.');
  });

  it("shows the server's refusal of an import", async () => {
    const page = await open('engineer');
    const input = page.querySelector<HTMLInputElement>('input[type=file]')!;
    Object.defineProperty(input, 'files', { value: [new File(['x'], 'issues.bcf')], configurable: true });
    input.dispatchEvent(new Event('change'));
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: `${findingsApi}/import` })).flush(
      { error: { code: 'bcf_not_zip', message: 'The file is not a BCF archive: it is not a readable zip file.', details: null } },
      { status: 400, statusText: 'Bad Request' },
    );
    await settle();
    expect(page.querySelector('[role=alert]')!.textContent).toContain('The file is not a BCF archive');
    expect(page.querySelector('.import-summary')).toBeNull();
  });
});
