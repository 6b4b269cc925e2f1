import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { TEST_RUN } from '../checks/checks.testing';
import { nextRequest, settle } from '../core/http.testing';
import { TEST_PROJECT_ID } from '../core/session.testing';
import { testDetail, testFinding } from '../findings/findings.testing';
import { revision } from '../models/models.testing';
import { configureProjectPagesForTests, openProjectSection } from '../projects/project.testing';

// Invented project data; the page's own choices are specified in viewer-page-data.spec.ts.
const api = `/api/projects/${TEST_PROJECT_ID}`;
const REV_1 = revision({ id: 'rev-1', number: 1 });
const REV_2 = revision({ id: 'rev-2', number: 2, fileName: 'canopy-rev-B.ifc' });
const GIRDER = { globalId: '2O2Fr$t4X7Zf8NOew3FLOH', tag: 'G-101', storey: 'Level 2', profileName: 'IPE 300' };
const LABELS = { columns: ['globalId', 'tag', 'profileName', 'storey'], members: [[GIRDER.globalId, GIRDER.tag, GIRDER.profileName, GIRDER.storey]] };

describe('ViewerPage', () => {
  let backend: HttpTestingController;
  let log: jest.SpyInstance;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
    // jsdom has no WebGL and logs "not implemented" for canvas contexts; the page must cope with that.
    log = jest.spyOn(console, 'error').mockImplementation(() => undefined);
  });

  afterEach(() => {
    log.mockRestore();
    backend.verify();
  });

  async function open(runs: object[]): Promise<HTMLElement> {
    const harness = await openProjectSection('engineer', '3d-view');
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [REV_2] });
    (await nextRequest(backend, `${api}/checks`)).flush({ runs });
    (await nextRequest(backend, `${api}/viewpoints`)).flush({ viewpoints: [] });
    await settle();
    (await nextRequest(backend, (r) => r.url === `${api}/models/rev-2/members/labels`)).flush(LABELS);
    await settle();
    return harness.routeNativeElement!.querySelector<HTMLElement>('tl-viewer-page')!;
  }

  const text = (element: HTMLElement) => element.textContent!.replace(/\s+/g, ' ');

  it('opens the newest ready revision with its latest run, and says where WebGL is missing', async () => {
    const page = await open([TEST_RUN]);
    (await nextRequest(backend, `${api}/checks/run-1/colours`)).flush({ members: { [GIRDER.globalId]: { u: 1.12, s: 'fail' } } });
    await settle();
    expect(text(page)).toContain('Revision 2 · canopy-rev-B.ifc');
    expect(text(page)).toContain('canopy-shears');
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('offers no WebGL 2');
    expect(text(page)).not.toContain('not checked:');
    // The legend stays on screen (the cautions are the frame's footer, app.spec.ts).
    expect(page.querySelector('tl-viewer-legend')).not.toBeNull();
  });

  it('draws every member as not checked when the revision has no finished run, and says so', async () => {
    const page = await open([{ ...TEST_RUN, status: 'running', finishedAt: null }]);
    expect(text(page)).toContain('No finished check run on revision 2: every member is drawn grey, as not checked.');
    backend.expectNone((r) => r.url.endsWith('/colours'));
  });

  it('explains an empty project instead of an empty view', async () => {
    const harness = await openProjectSection('engineer', '3d-view');
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [revision({ status: 'ingesting' })] });
    (await nextRequest(backend, `${api}/checks`)).flush({ runs: [] });
    (await nextRequest(backend, `${api}/viewpoints`)).flush({ viewpoints: [] });
    await settle();
    const page = harness.routeNativeElement!.querySelector<HTMLElement>('tl-viewer-page')!;
    expect(text(page)).toContain('No model revision is ready to view yet.');
    expect(page.querySelector('tl-viewer-workspace')).toBeNull();
  });

  it("opens a finding's revision through its run, and says when the finding cannot be read", async () => {
    const onRev1 = { ...TEST_RUN, id: 'run-rev-1', modelRevision: { ...TEST_RUN.modelRevision, id: 'rev-1', number: 1 } };
    const harness = await openProjectSection('engineer', '3d-view?viewpoint=finding-1');
    (await nextRequest(backend, `${api}/models`)).flush({ revisions: [REV_2, REV_1] });
    (await nextRequest(backend, `${api}/checks`)).flush({ runs: [TEST_RUN, onRev1] });
    (await nextRequest(backend, `${api}/viewpoints`)).flush({ viewpoints: [] });
    (await nextRequest(backend, `${api}/findings/finding-1`)).flush(testDetail({ finding: testFinding({ runId: 'run-rev-1' }) }));
    await settle();
    // The page waits for the finding before it chooses, so the newest revision is never loaded for nothing.
    backend.expectNone((r) => r.url === `${api}/models/rev-2/members/labels` || r.url.endsWith('/run-1/colours'));
    (await nextRequest(backend, (r) => r.url === `${api}/models/rev-1/members/labels`)).flush(LABELS);
    (await nextRequest(backend, `${api}/checks/run-rev-1/colours`)).flush({ members: {} });
    await settle();
    const page = harness.routeNativeElement!.querySelector<HTMLElement>('tl-viewer-page')!;
    expect(text(page)).toContain('Revision 1 · beam-varying-cardinal-points.ifc');

    await TestBed.inject(Router).navigateByUrl(`/projects/${TEST_PROJECT_ID}/3d-view?viewpoint=finding-2`);
    await settle();
    (await nextRequest(backend, `${api}/findings/finding-2`)).flush(
      { error: { code: 'not_found', message: 'No such finding in this project.' } },
      { status: 404, statusText: 'Not found' },
    );
    await settle();
    expect(text(page)).toContain("The finding's view could not be opened: No such finding in this project.");
    // Without the finding's run to go by, the view falls back to the newest revision and its latest run.
    (await nextRequest(backend, (r) => r.url === `${api}/models/rev-2/members/labels`)).flush(LABELS);
    (await nextRequest(backend, `${api}/checks/run-1/colours`)).flush({ members: {} });
    await settle();
    expect(text(page)).toContain('Revision 2 · canopy-rev-B.ifc');
  });
});
