import { HttpTestingController, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { nextRequest, settle } from '../../core/http.testing';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { rgbHexToCss, utilisationColour } from '../../viewer/utilisation-colours';
import { memberRow, TEST_RUN } from '../checks.testing';

const runApi = `/api/projects/${TEST_PROJECT_ID}/checks/run-1`;
const facets = { storeys: ['Level 1', 'Level 2'], profiles: ['IPE 300', 'IPE 360'] };

describe('RunResults', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  const membersRequest = (): Promise<TestRequest> => nextRequest(backend, (request) => request.url === `${runApi}/members`);
  const paramsOf = (request: TestRequest): Record<string, string> =>
    Object.fromEntries(request.request.params.keys().map((key) => [key, request.request.params.get(key)!]));

  async function open(query = ''): Promise<HTMLElement> {
    const harness = await openProjectSection('engineer', `checks/run-1${query}`);
    (await nextRequest(backend, runApi)).flush({ run: TEST_RUN });
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-run-results')!;
  }

  it('asks for the most utilised members first and shows them with the 3D view’s colours', async () => {
    const table = await open();
    const first = await membersRequest();
    expect(paramsOf(first)).toEqual({ sort: 'utilisation', dir: 'desc', page: '0', pageSize: '50' });
    first.flush({ total: 1, rows: [memberRow()], facets });
    await settle();

    const cells = [...table.querySelectorAll('tbody tr td')].map((td) => td.textContent!.replace(/\s+/g, ' ').trim());
    expect(table.querySelector('a.member-link')!.textContent).toBe('G-101');
    expect(table.querySelector('td .sub')!.textContent).toBe('Girder G-101');
    expect(cells.slice(1, 8)).toEqual(['Level 2', 'IPE 300', 'S355', 'ULS-2', 'major-axis shear', '405.2', '360.5']);
    // Percentages round up, as in reports: 1.1241 → 112.5 %.
    expect(cells[8]).toBe('112.5 %');
    const bar = table.querySelector<HTMLElement>('tl-utilisation-bar .bar')!;
    expect(bar.style.width).toBe('100%');
    expect(rgbHexToCss(Number.parseInt(hexOf(bar.style.backgroundColor), 16))).toBe(rgbHexToCss(utilisationColour(1.1241)));
    expect(cells[10]).toBe('grade assumed');
    const link = table.querySelector<HTMLAnchorElement>('a[aria-label="Show G-101 in 3D"]')!;
    expect(link.getAttribute('href')).toBe(`/projects/${TEST_PROJECT_ID}/3d-view?run=run-1&member=2O2Fr$t4X7Zf8NOew3FLOH`);
    expect(table.querySelector<HTMLAnchorElement>('a.member-link')!.getAttribute('href')).toBe(
      `/projects/${TEST_PROJECT_ID}/checks/run-1/members/2O2Fr$t4X7Zf8NOew3FLOH`,
    );
    const cards = [...table.querySelectorAll('.card')].map((card) => `${card.querySelector('.card-label')!.textContent}: ${card.querySelector('.card-value')!.textContent}`);
    expect(cards).toEqual([
      'Fail: 2',
      'Near the limit: 3',
      'Pass: 40',
      'Not checked: 1',
      'Not applicable: 4',
      'Highest utilisation: 112.5 %',
      'Result keys without a member: 5',
    ]);
    expect(table.querySelector('button.card')!.getAttribute('aria-label')).toBe('Fail: 2');
  });

  it('sorts on the server and starts again at the first page', async () => {
    const table = await open('?page=2');
    const first = await membersRequest();
    expect(paramsOf(first)['page']).toBe('2');
    first.flush({ total: 500, rows: [memberRow()], facets });
    await settle();

    table.querySelector<HTMLElement>('th.mat-column-profileName .mat-sort-header-container')!.click();
    const sorted = await membersRequest();
    expect(paramsOf(sorted)).toEqual({ sort: 'profileName', dir: 'asc', page: '0', pageSize: '50' });
    sorted.flush({ total: 500, rows: [memberRow()], facets });
    await settle();
    expect(TestBed.inject(Router).url).toBe(`/projects/${TEST_PROJECT_ID}/checks/run-1?sort=profileName&dir=asc`);
  });

  it('filters by status from a summary card and by utilisation range, and the CSV export follows', async () => {
    const table = await open();
    (await membersRequest()).flush({ total: 50, rows: [memberRow()], facets });
    await settle();

    [...table.querySelectorAll<HTMLButtonElement>('button.card')].find((card) => card.textContent!.includes('Fail'))!.click();
    const minimum = table.querySelector<HTMLInputElement>('input[formcontrolname=minUtilPercent]')!;
    minimum.value = '95';
    minimum.dispatchEvent(new Event('input'));
    // Filters wait for a pause in typing.
    await new Promise((resolve) => setTimeout(resolve, 350));
    const filtered = await membersRequest();
    expect(paramsOf(filtered)).toEqual({ sort: 'utilisation', dir: 'desc', page: '0', pageSize: '50', status: 'fail', minUtil: '0.95' });
    filtered.flush({ total: 2, rows: [memberRow()], facets });
    await settle();
    expect(table.querySelector<HTMLAnchorElement>('a[download]')!.getAttribute('href')).toBe(`${runApi}/members.csv?status=fail&minUtil=0.95`);
  });

  it('pages through large runs on the server', async () => {
    const table = await open('?status=fail&minUtil=90');
    const first = await membersRequest();
    expect(paramsOf(first)).toMatchObject({ status: 'fail', minUtil: '0.9' });
    first.flush({ total: 50_000, rows: [memberRow()], facets });
    await settle();
    expect(table.querySelector('.mat-mdc-paginator-range-label')?.textContent).toContain('1 – 50 of 50000');

    table.querySelector<HTMLButtonElement>('button.mat-mdc-paginator-navigation-next')!.click();
    const second = await membersRequest();
    expect(paramsOf(second)).toMatchObject({ page: '1', pageSize: '50', status: 'fail' });
    second.flush({ total: 50_000, rows: [memberRow({ globalId: '0K9x$vJ5r2Gg1x8Fq2n3mA', tag: 'G-151' })], facets });
  });
});

/** "rgb(240, 0, 240)" → "f000f0". */
function hexOf(css: string): string {
  const [r, g, b] = css.match(/\d+/g)!.map(Number);
  return ((r << 16) | (g << 8) | b).toString(16).padStart(6, '0');
}
