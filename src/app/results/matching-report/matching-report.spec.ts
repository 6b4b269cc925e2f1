import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { CSRF_TOKEN_URL } from '../../core/csrf.interceptor';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { MatchingPage, MatchingSummary, ResultSet } from '../results-api';

// An invented result set and its matching.
const api = `/api/projects/${TEST_PROJECT_ID}`;
const summary: MatchingSummary = {
  keys: 4,
  matched: 2,
  ambiguous: 1,
  unmatchedResults: 1,
  membersWithoutResults: 3,
  byMethod: { globalId: 0, tag: 2, name: 0, geometry: 0, manual: 0 },
  likelyOtherModel: false,
  warning: null,
};
const resultSet = {
  id: 'set-1',
  name: 'canopy-shears',
  fileName: 'canopy-shears.csv',
  rowCount: 8,
  combinations: ['ULS-1', 'ULS-2'],
  forceUnit: 'kN',
  modelRevisionId: 'rev-2',
  matching: summary,
} as ResultSet;
const page0: MatchingPage = {
  summary,
  total: 3,
  items: [
    { resultKey: 'G-101', globalId: '2O2Fr$t4X7Zf8NOew3FLOH', tag: 'G-101', name: 'Girder', method: 'tag', candidates: [] },
    {
      resultKey: 'B-7',
      globalId: null,
      tag: null,
      name: null,
      method: null,
      candidates: [
        { globalId: '1aaaaaaaaaaaaaaaaaaaaa', tag: 'B-7', name: 'Beam east' },
        { globalId: '1bbbbbbbbbbbbbbbbbbbbb', tag: 'B-7', name: 'Beam west' },
      ],
    },
    { resultKey: 'X-99', globalId: null, tag: null, name: null, method: null, candidates: [] },
  ],
};

describe('MatchingReport', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  const matchingRequest = (): Promise<TestRequest> => nextRequest(backend, (request) => request.url === `${api}/results/set-1/matching`);

  async function open(role: ProjectRole): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'shear-results/set-1');
    (await nextRequest(backend, `${api}/results/set-1`)).flush({ resultSet });
    const matching = await matchingRequest();
    expect(matching.request.params.get('filter')).toBe('all');
    expect(matching.request.params.get('modelRevisionId')).toBe('rev-2');
    matching.flush(page0);
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-matching-report')!;
  }

  it('counts each list and shows how each key matched', async () => {
    const page = await open('reviewer');
    const filters = [...page.querySelectorAll('mat-button-toggle')].map((toggle) => toggle.textContent!.replace(/\s+/g, ' ').trim());
    expect(filters).toEqual(['All', 'Matched 2', 'Ambiguous 1', 'No member 1', 'Members without results 3']);
    const rows = [...page.querySelectorAll('tbody tr')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows[0]).toContain('Tag');
    // Candidates of an ambiguous key show enough to tell them apart.
    expect(rows[1]).toContain('B-7 · Beam east');
    expect(rows[1]).toContain('B-7 · Beam west');
    expect(rows[2]).toContain('No member');
    // Reviewers read; only matching.edit may change matches.
    expect(page.querySelector('button[aria-label^="Choose the member"]')).toBeNull();
  });

  it('shows one list at a time from the server', async () => {
    const page = await open('reviewer');
    [...page.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')].find((button) => button.textContent!.includes('No member'))!.click();
    const unmatched = await matchingRequest();
    expect(unmatched.request.params.get('filter')).toBe('unmatched');
    expect(unmatched.request.params.get('page')).toBe('0');
    unmatched.flush({ summary, total: 1, items: [page0.items[2]] });
  });

  it('lets a coordinator pick one of the candidates of an ambiguous key', async () => {
    const page = await open('coordinator');
    page.querySelector<HTMLButtonElement>('button[aria-label="Choose the member for B-7"]')!.click();
    await settle();
    [...page.querySelectorAll<HTMLButtonElement>('.editor button')].find((button) => button.textContent!.includes('Beam east'))!.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const put = await nextRequest(backend, { method: 'PUT', url: `${api}/results/set-1/matches/B-7` });
    expect(put.request.body).toEqual({ globalId: '1aaaaaaaaaaaaaaaaaaaaa' });
    put.flush({ item: { ...page0.items[1], globalId: '1aaaaaaaaaaaaaaaaaaaaa', method: 'manual' }, summary: { ...summary, matched: 3, ambiguous: 0 } });
    (await matchingRequest()).flush(page0);
    await settle();
    expect(page.querySelector('[role=status]')!.textContent).toContain('B-7 now goes to B-7 · Beam east.');
  });

  it('finds a member by tag for a key that matched nothing', async () => {
    const page = await open('coordinator');
    page.querySelector<HTMLButtonElement>('button[aria-label="Choose the member for X-99"]')!.click();
    await settle();
    const search = page.querySelector<HTMLInputElement>('tl-member-search input')!;
    search.focus();
    search.value = 'G-2';
    search.dispatchEvent(new Event('input'));
    await new Promise((resolve) => setTimeout(resolve, 300));
    const found = await nextRequest(backend, (request) => request.url === `${api}/models/rev-2/members`);
    expect(found.request.params.get('q')).toBe('G-2');
    found.flush({ total: 1, members: [{ globalId: '3ccccccccccccccccccccc', tag: 'G-201', name: 'Girder north' }] });
    await settle();
    const option = [...document.querySelectorAll<HTMLElement>('mat-option')].find((item) => item.textContent!.includes('G-201'))!;
    option.click();
    (await nextRequest(backend, CSRF_TOKEN_URL)).flush({ token: 't' });
    const put = await nextRequest(backend, { method: 'PUT', url: `${api}/results/set-1/matches/X-99` });
    expect(put.request.body).toEqual({ globalId: '3ccccccccccccccccccccc' });
    put.flush({ item: page0.items[2], summary });
    (await matchingRequest()).flush(page0);
  });
});
