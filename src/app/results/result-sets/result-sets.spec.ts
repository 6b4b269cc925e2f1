import { HttpTestingController } from '@angular/common/http/testing';
import { nextRequest, settle } from '../../core/http.testing';
import { ProjectRole } from '../../core/permissions';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { ResultSet } from '../results-api';

const api = `/api/projects/${TEST_PROJECT_ID}`;
// An invented set whose keys hardly match: the loud case.
const poorly = {
  id: 'set-1',
  name: 'shears for the other job',
  fileName: 'other.csv',
  rowCount: 12000,
  combinations: ['ULS-1', 'ULS-2', 'SLS-1'],
  forceUnit: 'kN',
  createdBy: { id: 'user-coordinator', name: 'Test coordinator' },
  createdAt: '2026-03-04T10:00:00Z',
  modelRevisionId: 'rev-2',
  matching: {
    keys: 400,
    matched: 3,
    ambiguous: 1,
    unmatchedResults: 396,
    membersWithoutResults: 180,
    byMethod: { globalId: 0, tag: 3, name: 0, geometry: 0, manual: 0 },
    likelyOtherModel: true,
    warning: 'Only 3 of 400 result keys (1 %) match a member of revision 2.',
  },
} as ResultSet;

describe('ResultSets', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  async function open(role: ProjectRole): Promise<HTMLElement> {
    const harness = await openProjectSection(role, 'shear-results');
    (await nextRequest(backend, `${api}/results`)).flush({ resultSets: [poorly] });
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [{ id: 'rev-2', number: 2, fileName: 'b.ifc', status: 'ready', uploadedAt: '2026-03-03T10:00:00Z' }] });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-result-sets')!;
  }

  it('lists sets with their counts and warns loudly when almost nothing matched', async () => {
    const page = await open('engineer');
    const cells = [...page.querySelectorAll('tbody td')].map((td) => td.textContent!.replace(/\s+/g, ' ').trim());
    expect(cells.slice(1, 7)).toEqual(['other.csv', 'Revision 2', '12,000', '3', '3', '397']);
    expect(page.querySelector('.match-warning')!.textContent).toContain('Only 3 of 400 result keys');
    expect(page.querySelector('a[href$="/shear-results/import"]')).toBeNull();
  });

  it('offers the import to a coordinator', async () => {
    const page = await open('coordinator');
    expect(page.querySelector('a[href$="/shear-results/import"]')!.textContent).toContain('Import shear results');
  });
});
