import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { nextRequest, provideApiForTests, settle } from '../../core/http.testing';
import type { MemberRecord } from '../models-api';
import { channelRecord, taperedRecord, tubeRecord } from '../models.testing';
import { MemberDetail } from './member-detail';

const api = '/api/projects/project-1/models/rev-1/members';

let backend: HttpTestingController;

beforeEach(() => {
  TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
  backend = TestBed.inject(HttpTestingController);
});

afterEach(() => backend.verify());

async function render(member: MemberRecord): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(MemberDetail);
  fixture.componentRef.setInput('projectId', 'project-1');
  fixture.componentRef.setInput('revisionId', 'rev-1');
  fixture.componentRef.setInput('globalId', member.globalId);
  fixture.detectChanges();
  (await nextRequest(backend, `${api}/${encodeURIComponent(member.globalId)}`)).flush({ member });
  await settle();
  return fixture.nativeElement as HTMLElement;
}

const text = (element: Element) => element.textContent!.replace(/\s+/g, ' ').trim();
const flagNotes = (page: HTMLElement) => [...page.querySelectorAll('.flags dt')].map((dt) => [text(dt), text(dt.nextElementSibling!)]);
const rows = (page: HTMLElement, table: string) => [...page.querySelectorAll(`table.${table} tbody tr`)].map((row) => [...row.children].map(text));

describe('MemberDetail', () => {
  it('shows a channel with its family, how it was found and its own dimensions (UPN 200, EN 10365, from memory)', async () => {
    const page = await render(channelRecord());
    expect(text(page.querySelector('h3')!)).toBe('Section UPN 200');
    expect(text(page.querySelector('h3 + .sub')!)).toBe('channel; measured from the profile outline (IfcArbitraryClosedProfileDef)');
    expect(rows(page, 'dims')).toEqual([
      ['Depth', '200 mm'],
      ['Width, web included', '75 mm'],
      ['Web thickness', '8.5 mm'],
      ['Flange thickness', '11.5 mm'],
      ['Root radius', '11.5 mm'],
      ['Flange tip radius', '6 mm'],
      ['Flange slope', '8 %'],
    ]);
    expect(text(page)).toContain('No shear rule: ' + channelRecord().reason);
    expect(page.querySelector('table.stations')).toBeNull();
  });

  it('shows a circular hollow section by diameter and wall, and explains a name that differs from the geometry (CHS, EN 10210-2, from memory)', async () => {
    const differing: MemberRecord = { ...tubeRecord(), flags: ['name-and-geometry-differ'] };
    const page = await render(differing);
    expect(text(page.querySelector('h3 + .sub')!)).toBe('circular hollow section; dimensions written in the model (IfcCircleHollowProfileDef)');
    expect(rows(page, 'dims')).toEqual([
      ['Outside diameter', '168.3 mm'],
      ['Wall thickness', '8 mm'],
    ]);
    expect(flagNotes(page)).toEqual([
      ['name and geometry differ', "The section's name and its measured geometry disagree; the geometry is used. Ask the modeller which one is meant."],
    ]);
  });

  it('shows a tapered I-section at both ends and which one the checks use (IPE 400 to IPE 300, EN 10365, from memory)', async () => {
    const page = await render(taperedRecord());
    expect(text(page.querySelector('h3')!)).toBe('Section (no name)');
    expect(text(page.querySelector('h3 + .sub')!)).toBe('I-section, welded; dimensions written in the model (IfcExtrudedAreaSolidTapered)');
    // The profile's own dimensions are the governing (smaller) end.
    expect(rows(page, 'dims')[0]).toEqual(['Depth', '300 mm']);
    expect(rows(page, 'stations')).toEqual([
      ['0 % (start)', 'd 400, tw 8.6, flanges 180×13.5'],
      ['100 % (end)', 'd 300, tw 7.1, flanges 150×10.7 used'],
    ]);
    expect(page.querySelector('table.stations tr.governs')!.textContent).toContain('d 300');
    expect(text(page.querySelector('table.stations + .sub')!)).toBe('The checks use the smaller section, at the end; never a larger one.');
    expect(flagNotes(page)).toEqual([['tapered', 'The section varies along the member: the end sections are kept and the checks use the smaller one, never the larger.']]);
  });

  it('explains a section that could not be recognised on a member without a profile', async () => {
    const flagged: MemberRecord = {
      ...tubeRecord(),
      status: 'flagged',
      reason: 'The section of the body (IfcFacetedBrep) could not be recognised: two separate pieces.',
      profile: null,
      flags: ['section-unrecognised', 'geometry-unread'],
    };
    const page = await render(flagged);
    expect(page.querySelector('table.dims')).toBeNull();
    expect(flagNotes(page)).toEqual([
      ['section not recognised', 'The outline or the cut through the body is not a shape Taulens recognises, so the member is not checked.'],
      ['body not measured', 'The body could not be cut to measure the section, so only a section name found in a catalogue can give its dimensions.'],
    ]);
  });
});
