import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { ResultSet, RevisionChoice } from '../../results/results-api';
import { CheckRun } from '../checks-api';
import { TEST_RUN } from '../checks.testing';
import { RUN_POLL_INTERVAL_MS } from '../reload-while';

const api = `/api/projects/${TEST_PROJECT_ID}`;
const running: CheckRun = { ...TEST_RUN, id: 'run-2', status: 'running', progress: { fraction: 0.4 }, finishedAt: null, summary: null };
const revisions: RevisionChoice[] = [
  { id: 'rev-2', number: 2, fileName: 'canopy-rev-B.ifc', status: 'ready', uploadedAt: '2026-03-03T10:00:00Z' },
  { id: 'rev-1', number: 1, fileName: 'canopy-rev-A.ifc', status: 'ready', uploadedAt: '2026-03-02T10:00:00Z' },
];
const resultSets = [
  { id: 'set-old', name: 'shears A', fileName: 'a.csv', modelRevisionId: 'rev-1' },
  { id: 'set-new', name: 'shears B', fileName: 'b.csv', modelRevisionId: 'rev-2' },
] as ResultSet[];

describe('CheckRuns', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole, runs: CheckRun[]): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'checks');
    (await nextRequest(backend, `${api}/checks`)).flush({ runs });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-check-runs')!;
  }

  const startButton = (page: HTMLElement) => [...page.querySelectorAll('button')].find((button) => button.textContent!.includes('Start a check'));
  const dialogButton = (label: string) =>
    [...document.querySelectorAll<HTMLButtonElement>('tl-start-check-dialog button')].find((button) => button.textContent!.includes(label))!;

  it('lists runs with their status, and follows a running one until it ends', async () => {
    const page = await open('reviewer', [running, TEST_RUN]);
    const rows = [...page.querySelectorAll('tbody tr')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Running');
    expect(rows[1]).toContain('Finished');
    expect(rows[1]).toContain('2 fail · 3 near the limit · 40 pass · highest 112.5 %');
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    expect(startButton(page)).toBeUndefined();

    await new Promise((resolve) => setTimeout(resolve, RUN_POLL_INTERVAL_MS + 50));
    (await nextRequest(backend, `${api}/checks`)).flush({ runs: [{ ...running, status: 'done', progress: null, summary: TEST_RUN.summary }, TEST_RUN] });
    await settle();
    expect(page.querySelector('mat-progress-bar')).toBeNull();
    // Nothing is running any more, so nothing else is asked.
    await new Promise((resolve) => setTimeout(resolve, RUN_POLL_INTERVAL_MS + 50));
    backend.expectNone(`${api}/checks`);
    // Two polling intervals of real time.
  }, 15_000);

  it('starts a check with the recommended parameters, and runs it anyway only after the loud warning', async () => {
    const page = await open('engineer', []);
    startButton(page)!.click();
    (await nextRequest(backend, `${api}/models`)).flush({ revisions });
    (await nextRequest(backend, `${api}/results`)).flush({ resultSets });
    (await nextRequest(backend, `${api}/models/rev-2/members/facets`)).flush({ storeys: [], profiles: ['IPE 300', 'WPG 900'] });
    await settle();

    dialogButton('Start the check').click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const first = await nextRequest(backend, { method: 'POST', url: `${api}/checks` });
    expect(first.request.body).toEqual({
      modelRevisionId: 'rev-2',
      resultSetId: 'set-new',
      standard: 'en1993-1-1',
      parameters: {
        standard: 'en1993-1-1',
        defaultGrade: 'S355',
        warningRatio: 0.9,
        stiffenerSpacing_mm: null,
        fabricationOverrides: {},
        gammaM0: 1,
        gammaM1: 1,
        eta: null,
        yieldRule: 'en10025-2',
        endPost: 'non-rigid',
      },
    });
    first.flush(
      { error: { code: 'poor_match', message: 'Only 2 of 40 result keys (5 %) match a member of revision 2.', details: {} } },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await settle();
    const warning = document.querySelector('.poor-match')!;
    expect(warning.getAttribute('role')).toBe('alert');
    expect(warning.textContent).toContain('Only 2 of 40 result keys');
    expect(dialogButton('Start the check').disabled).toBe(true);

    dialogButton('Run anyway').click();
    const second = await nextRequest(backend, { method: 'POST', url: `${api}/checks` });
    expect(second.request.body).toMatchObject({ resultSetId: 'set-new', confirmPoorMatch: true });
    second.flush({ run: { ...running, id: 'run-9' } }, { status: 202, statusText: 'Accepted' });
    await settle();
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(TestBed.inject(Router).url).toBe(`/projects/${TEST_PROJECT_ID}/checks/run-9`);
    (await nextRequest(backend, `${api}/checks/run-9`)).flush({ run: { ...TEST_RUN, id: 'run-9' } });
    (await nextRequest(backend, (request) => request.url === `${api}/checks/run-9/members`)).flush({ total: 0, rows: [], facets: { storeys: [], profiles: [] } });
  });

  it('says why a check cannot start on a revision that is still being read', async () => {
    const page = await open('engineer', []);
    startButton(page)!.click();
    (await nextRequest(backend, `${api}/models`)).flush({ revisions });
    (await nextRequest(backend, `${api}/results`)).flush({ resultSets });
    (await nextRequest(backend, `${api}/models/rev-2/members/facets`)).flush({ storeys: [], profiles: [] });
    await settle();
    dialogButton('Start the check').click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    (await nextRequest(backend, { method: 'POST', url: `${api}/checks` })).flush(
      { error: { code: 'revision_not_ready', message: 'Revision 2 is still being read; start the check when it is ready.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle();
    expect(document.querySelector('tl-start-check-dialog .failure')!.textContent).toContain('still being read');
    dialogButton('Cancel').click();
    await new Promise((resolve) => setTimeout(resolve, 300));
  });
});
