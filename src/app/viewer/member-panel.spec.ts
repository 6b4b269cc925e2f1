import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { memberRow } from '../checks/checks.testing';
import { nextRequest, provideApiForTests, settle } from '../core/http.testing';
import { MemberPanel, rowOf } from './member-panel';
import type { ViewerMember } from './viewer-member';

// Invented members; the panel only shows what the API answers.
const GIRDER = memberRow();
const NEIGHBOUR = memberRow({ globalId: `${GIRDER.globalId.slice(0, 21)}X`, tag: 'G-102', status: 'pass', utilisation: 0.5 });
const KNOWN: ViewerMember = {
  globalId: GIRDER.globalId,
  tag: 'G-101',
  section: 'IPE 300',
  storey: 'Level 2',
  utilisationRatio: 1.1241,
  status: 'fail',
};

let backend: HttpTestingController;

beforeEach(() => {
  TestBed.configureTestingModule({ providers: [provideRouter([]), ...provideApiForTests()] });
  backend = TestBed.inject(HttpTestingController);
});

afterEach(() => backend.verify());

async function render(runId: string | null): Promise<HTMLElement> {
  const fixture = TestBed.createComponent(MemberPanel);
  fixture.componentRef.setInput('projectId', 'project-1');
  fixture.componentRef.setInput('runId', runId);
  fixture.componentRef.setInput('globalId', GIRDER.globalId);
  fixture.componentRef.setInput('member', KNOWN);
  fixture.detectChanges();
  await settle();
  return fixture.nativeElement as HTMLElement;
}

async function answer(body: object | { status: number; error: object }): Promise<void> {
  const request = await nextRequest(backend, (r) => r.url === '/api/projects/project-1/checks/run-1/members');
  expect(request.request.params.get('q')).toBe(GIRDER.globalId);
  if ('status' in body) request.flush(body.error, { status: body.status, statusText: 'error' });
  else request.flush(body);
  await settle();
}

function text(element: HTMLElement): string {
  return element.textContent?.replace(/\s+/g, ' ') ?? '';
}

describe('rowOf', () => {
  it('picks the exact GlobalId from a search that matched more', () => {
    expect(rowOf({ total: 2, rows: [NEIGHBOUR, GIRDER], facets: { storeys: [], profiles: [] } }, GIRDER.globalId)).toBe(GIRDER);
    expect(rowOf({ total: 1, rows: [NEIGHBOUR], facets: { storeys: [], profiles: [] } }, GIRDER.globalId)).toBeNull();
  });
});

describe('MemberPanel', () => {
  it("shows the member's governing result and links its calculation sheet", async () => {
    const element = await render('run-1');
    await answer({ total: 2, rows: [NEIGHBOUR, GIRDER], facets: { storeys: [], profiles: [] } });
    const shown = text(element);
    expect(element.querySelector('h2')?.textContent).toBe('G-101');
    expect(shown).toContain('Fail');
    expect(shown).toContain('ULS-2');
    expect(shown).toContain('405.2 kN');
    expect(shown).toContain('360.5 kN');
    expect(shown).toContain('210.4 MPa');
    expect(shown).toContain('grade assumed');
    const link = element.querySelector('a[href]');
    expect(link?.getAttribute('href')).toBe(`/projects/project-1/checks/run-1/members/${GIRDER.globalId}`);
  });

  it('says when the run holds no result for the member', async () => {
    const element = await render('run-1');
    await answer({ total: 1, rows: [NEIGHBOUR], facets: { storeys: [], profiles: [] } });
    expect(text(element)).toContain('This check run holds no result for the member.');
    expect(element.querySelector('a[href]')).toBeNull();
  });

  it('shows the server’s message when the results cannot be read', async () => {
    const element = await render('run-1');
    await answer({ status: 403, error: { error: { code: 'forbidden', message: 'Your role cannot read check results.' } } });
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('Your role cannot read check results.');
  });

  it('says the member is not checked without a run, from what the view knows', async () => {
    const element = await render(null);
    const shown = text(element);
    expect(shown).toContain('Not checked: this revision has no finished check run.');
    expect(shown).toContain('IPE 300');
    expect(shown).toContain('Level 2');
    expect(element.querySelector('a[href]')).toBeNull();
  });
});
