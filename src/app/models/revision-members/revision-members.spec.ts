import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { nextRequest, settle } from '../../core/http.testing';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { memberFacets, memberRecord, memberRow, revision } from '../models.testing';

const api = `/api/projects/${TEST_PROJECT_ID}/models/rev-1`;
const membersRequest = (params: Record<string, string>) => (request: { url: string; params: { get(name: string): string | null } }) =>
  request.url === `${api}/members` && Object.entries(params).every(([name, value]) => request.params.get(name) === value);

describe('RevisionMembers', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  const assumed = memberRow({ globalId: '3Cyaczln1DyfCVyfoF1Fyl', expressId: 230, name: 'BotMid', grade: 'S355', gradeAssumed: true, flags: ['assumed-grade', 'no-material'] });
  const brace = memberRow({
    globalId: '1xe23DCTfXVVqeTb00000T',
    expressId: 365,
    name: 'BR1',
    status: 'not-applicable',
    reason: "Not an I-section: its profile is 'CHS 168.3x8' (IfcCircleHollowProfileDef).",
    profileName: null,
    profileSource: null,
    profileType: null,
    profileFamily: null,
    fabrication: null,
    depth_mm: null,
    webThickness_mm: null,
    flangeWidth_mm: null,
    flangeThickness_mm: null,
    fy_MPa: null,
    gradeAssumed: null,
  });

  async function open(): Promise<HTMLElement> {
    const harness = await openProjectSection('engineer', 'models/rev-1');
    (await nextRequest(backend, api)).flush({ revision: revision({ counts: { members: 3, ok: 2, notApplicable: 1, flagged: 0, context: 2 } }) });
    await settle();
    (await nextRequest(backend, membersRequest({ sort: 'expressId', dir: 'asc', page: '0', pageSize: '50' }))).flush({ total: 2, members: [memberRow(), assumed] });
    (await nextRequest(backend, `${api}/members/facets`)).flush(memberFacets({ profiles: ['IPE200'], families: ['I'], sources: ['ifc-profile'], skipped: [] }));
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-revision-members')!;
  }

  const rowTexts = (page: HTMLElement) => [...page.querySelectorAll('tr.mat-mdc-row')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());

  it('shows the sections read, with an assumed grade marked', async () => {
    const page = await open();
    expect(page.textContent).toContain('3 beams, columns and members');
    const [first, second] = rowTexts(page);
    expect(first).toContain('IPE200');
    expect(first).toContain('100 × 8.5');
    expect(first).toContain('Section read');
    expect(first).not.toContain('assumed');
    expect(second).toContain('S355 assumed');
    expect(second).toContain('grade assumed');
  });

  it('asks the server to sort and filter', async () => {
    const page = await open();
    page.querySelector<HTMLElement>('th.mat-column-depth_mm .mat-sort-header-container')!.click();
    (await nextRequest(backend, membersRequest({ sort: 'depth_mm', dir: 'asc', page: '0' }))).flush({ total: 2, members: [memberRow(), assumed] });
    const search = page.querySelector<HTMLInputElement>('input[type=search]')!;
    search.value = 'botmid';
    search.dispatchEvent(new Event('input'));
    (await nextRequest(backend, membersRequest({ sort: 'depth_mm', q: 'botmid' }))).flush({ total: 1, members: [assumed] });
    await settle();
    expect(rowTexts(page)).toHaveLength(1);
    expect(page.querySelector('.count')!.textContent).toContain('1 member');
  });

  it('lists what was skipped and why', async () => {
    const page = await open();
    [...page.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')].find((b) => b.textContent!.includes('Skipped and why'))!.click();
    (await nextRequest(backend, membersRequest({ status: 'not-applicable,flagged', page: '0' }))).flush({ total: 1, members: [brace] });
    await settle();
    const [row] = rowTexts(page);
    expect(row).toContain('No shear rule');
    expect(row).toContain("its profile is 'CHS 168.3x8' (IfcCircleHollowProfileDef)");
  });

  it('opens the whole record of a member', async () => {
    const page = await open();
    page.querySelector<HTMLButtonElement>('button.member-link')!.click();
    const detail: TestRequest = await nextRequest(backend, `${api}/members/06uVDzM0j8rugiazVexGkx`);
    detail.flush({ member: memberRecord() });
    await settle();
    const text = page.querySelector('tl-member-detail')!.textContent!.replace(/\s+/g, ' ');
    expect(text).toContain('S355JR → grade S355, fy 355 MPa');
    expect(text).toContain('Bottom flange100 × 8.5 mm, r 12 mm');
    expect(text).toContain('(0, 0, 0) → (1,000, 0, 0) mm');
  });

  it('says a revision is still being read', async () => {
    const harness = await openProjectSection('engineer', 'models/rev-1');
    (await nextRequest(backend, api)).flush({ revision: revision({ status: 'ingesting', progress: { phase: 'members', fraction: 0.4 }, counts: null }) });
    await settle();
    expect(harness.routeNativeElement!.textContent).toContain('Reading members and sections · 40 %. The members appear here once the file has been read.');
  });
});
