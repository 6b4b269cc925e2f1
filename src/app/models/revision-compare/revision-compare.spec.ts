import { HttpTestingController } from '@angular/common/http/testing';
import { nextRequest, settle } from '../../core/http.testing';
import { TEST_PROJECT_ID } from '../../core/session.testing';
import { configureProjectPagesForTests, openProjectSection } from '../../projects/project.testing';
import { memberRow, revision } from '../models.testing';

const api = `/api/projects/${TEST_PROJECT_ID}/models`;

describe('RevisionCompare', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    backend = configureProjectPagesForTests();
  });

  afterEach(() => backend.verify());

  it('compares the two newest ready revisions and lists what changed', async () => {
    const older = revision({ id: 'rev-1', number: 1, fileName: 'frame-rev-C.ifc' });
    const newer = revision({ id: 'rev-2', number: 2, fileName: 'frame-rev-D.ifc' });
    const failed = revision({ id: 'rev-3', number: 3, status: 'failed', counts: null });
    const harness = await openProjectSection('reviewer', 'models/compare');
    (await nextRequest(backend, api)).flush({ revisions: [failed, newer, older] });
    const compare = await nextRequest(backend, (r) => r.url === `${api}/compare`);
    expect([compare.request.params.get('from'), compare.request.params.get('to')]).toEqual(['rev-1', 'rev-2']);
    compare.flush({
      from: older,
      to: newer,
      added: [memberRow({ globalId: '3BrdNewGlobalId0000001', tag: 'T99' })],
      removed: [],
      changed: [{ globalId: '0jpGXTmeNrH_ikRE00000z', tag: 'T52', name: 'B52', changes: [{ field: 'section', from: 'IPE 300', to: 'IPE 270' }] }],
      unchanged: 398,
    });
    await settle();
    const page = harness.routeNativeElement!;
    const rows = [...page.querySelectorAll('tbody tr')].map((row) => row.textContent!.replace(/\s+/g, ' ').trim());
    expect(rows).toEqual([expect.stringContaining('T52'), expect.stringContaining('T99')]);
    expect(rows[0]).toContain('Section IPE 300 → IPE 270');
    expect(rows[1]).toContain('Added');
    expect(page.querySelector('.summary')!.textContent!.replace(/\s+/g, ' ')).toContain('398 unchanged');
  });
});
