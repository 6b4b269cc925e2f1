import { HttpRequest } from '@angular/common/http';
import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import { CHANNEL_ROW, memberFacets, memberRow, TUBE_ROW } from '../models.testing';
import type { MemberFacets } from '../models-api';
import { MemberTable, MemberTableView } from './member-table';

const api = '/api/projects/project-1/models/rev-1';
const membersRequest = (params: Record<string, string | null>) => (request: HttpRequest<unknown>) =>
  request.url === `${api}/members` && Object.entries(params).every(([name, value]) => request.params.get(name) === value);

let backend: HttpTestingController;

beforeEach(() => {
  TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
  backend = TestBed.inject(HttpTestingController);
});

afterEach(() => backend.verify());

async function render(view: MemberTableView, facets: MemberFacets = memberFacets()): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(MemberTable);
  fixture.componentRef.setInput('projectId', 'project-1');
  fixture.componentRef.setInput('revisionId', 'rev-1');
  fixture.componentRef.setInput('view', view);
  fixture.detectChanges();
  await settle();
  (await nextRequest(backend, membersRequest({ page: '0' }))).flush({ total: 3, members: [memberRow(), CHANNEL_ROW, TUBE_ROW] });
  (await nextRequest(backend, `${api}/members/facets`)).flush(facets);
  await settle();
  return fixture.nativeElement as HTMLElement;
}

const text = (element: Element) => element.textContent!.replace(/\s+/g, ' ').trim();
/** Each row's cells, joined with ' | '. */
const rowTexts = (page: HTMLElement) => [...page.querySelectorAll('tr.mat-mdc-row')].map((row) => [...row.querySelectorAll('td')].map(text).join(' | '));

async function choose(page: HTMLElement, field: string, option: string): Promise<void> {
  const select = [...page.querySelectorAll('mat-form-field')].find((f) => f.querySelector('mat-label')!.textContent!.trim() === field)!;
  select.querySelector<HTMLElement>('mat-select')!.click();
  await settle();
  [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => o.textContent!.trim() === option)!.click();
  await settle();
}

describe('MemberTable', () => {
  it('lists every family with its dimensions and says how each section was found', async () => {
    const page = await render('sections');
    const [beam, channel, tube] = rowTexts(page);
    expect(beam).toContain('IPE200 rolled, dimensions written in the model | I-section | 200 | 5.6 | 100 × 8.5 |');
    expect(channel).toContain('UPN 200 measured from the profile outline | channel | 200 | 8.5 | 75 × 11.5 |');
    expect(channel).toContain('| No shear rule |');
    // A tube has no flange: its width (the diameter) stands alone.
    expect(tube).toContain('CHS 168.3x8 dimensions written in the model | circular hollow section | 168.3 | 8 | 168.3 |');
  });

  it('keeps units apart from the names in the column headers', async () => {
    const page = await render('sections');
    const headers = [...page.querySelectorAll('th.mat-mdc-header-cell')].map(text);
    expect(headers).toEqual(expect.arrayContaining(['Family', 'Depth (mm)', 'Web tw (mm)', 'Flange b × tf (mm)', 'fy (MPa)', 'Length (mm)']));
    expect(headers.some((h) => / mm$| MPa$/.test(h))).toBe(false);
  });

  it('filters by family and by how the section was found, offering only those present', async () => {
    const page = await render('sections');
    await choose(page, 'Family', 'channel');
    (await nextRequest(backend, membersRequest({ family: 'channel', source: null, page: '0' }))).flush({ total: 1, members: [CHANNEL_ROW] });
    await settle();
    expect(rowTexts(page)).toHaveLength(1);

    page.querySelector<HTMLElement>('mat-form-field.source mat-select')!.click();
    await settle();
    const offered = [...document.querySelectorAll('mat-option')].map(text);
    expect(offered).toEqual(['Any way', 'dimensions written in the model', 'measured from the profile outline']);
    [...document.querySelectorAll<HTMLElement>('mat-option')].find((o) => text(o) === 'measured from the profile outline')!.click();
    await settle();
    (await nextRequest(backend, membersRequest({ family: 'channel', source: 'outline' }))).flush({ total: 1, members: [CHANNEL_ROW] });
    await settle();
  });

  it('counts the skipped members by reason above the table', async () => {
    const page = await render('skipped');
    const reasons = [...page.querySelectorAll('.reasons li')].map((item) => [...item.children].map(text));
    expect(reasons).toEqual([
      ['6', TUBE_ROW.reason],
      ['2', CHANNEL_ROW.reason],
    ]);
    expect(rowTexts(page)[1]).toContain('P4Purlin P4 | IfcMember | — | channel | No shear rule |');
  });

  it('shows no reason counts among the sections, nor when nothing was skipped', async () => {
    expect((await render('sections')).querySelector('.reasons')).toBeNull();
    expect((await render('skipped', memberFacets({ skipped: [] }))).querySelector('.reasons')).toBeNull();
  });
});
