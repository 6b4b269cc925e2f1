// Invented revisions, runs and members; these specs check the page's own choices and conversions.
import { TEST_RUN } from '../checks/checks.testing';
import type { CheckRun } from '../checks/checks-api';
import { testFinding } from '../findings/findings.testing';
import type { MemberLabelRow } from '../models/models-api';
import { revision } from '../models/models.testing';
import {
  base64OfBytes,
  defaultRevision,
  finishedRunsOn,
  revisionToOpen,
  runToShow,
  savedViewpointRequest,
  viewerMembers,
  viewpointOfFinding,
  viewpointOfSaved,
} from './viewer-page-data';
import type { ViewerCamera, ViewerViewpoint } from './viewpoint';

const REV_1 = revision({ id: 'rev-1', number: 1 });
const REV_2 = revision({ id: 'rev-2', number: 2 });
const REV_3_INGESTING = revision({ id: 'rev-3', number: 3, status: 'ingesting' });

function run(overrides: Partial<CheckRun>): CheckRun {
  return { ...TEST_RUN, ...overrides };
}

const OLD_RUN = run({ id: 'run-old', finishedAt: '2026-03-05T09:00:00Z' });
const NEW_RUN = run({ id: 'run-new', finishedAt: '2026-03-06T09:00:00Z' });
const RUNNING = run({ id: 'run-busy', status: 'running', finishedAt: null, createdAt: '2026-03-07T09:00:00Z' });
const ON_REV_1 = run({ id: 'run-rev-1', modelRevision: { ...TEST_RUN.modelRevision, id: 'rev-1', number: 1 } });

const CAMERA: ViewerCamera = {
  kind: 'perspective',
  fieldOfView_deg: 60,
  viewPoint_m: [10, -10, 8],
  direction: [-0.6, 0.6, -0.5],
  up: [0, 0, 1],
  aspectRatio: 1.6,
};
const PLANE = { location_m: [0, 0, 3] as const, direction: [0, 0, 1] as const };

describe('defaultRevision', () => {
  it('takes the newest revision that is ready', () => {
    expect(defaultRevision([REV_3_INGESTING, REV_2, REV_1])?.id).toBe('rev-2');
    expect(defaultRevision([REV_1, REV_2])?.id).toBe('rev-2');
  });

  it('is null when nothing is ready', () => {
    expect(defaultRevision([REV_3_INGESTING])).toBeNull();
    expect(defaultRevision([])).toBeNull();
  });
});

describe('finishedRunsOn and runToShow', () => {
  const runs = [OLD_RUN, RUNNING, NEW_RUN, ON_REV_1];

  it('lists only finished runs on the revision, newest first', () => {
    expect(finishedRunsOn(runs, 'rev-2').map((r) => r.id)).toEqual(['run-new', 'run-old']);
    expect(finishedRunsOn(runs, 'rev-1').map((r) => r.id)).toEqual(['run-rev-1']);
    expect(finishedRunsOn(runs, null)).toEqual([]);
  });

  it('shows the latest finished run unless a link names another finished run on the revision', () => {
    expect(runToShow(runs, 'rev-2', null)?.id).toBe('run-new');
    expect(runToShow(runs, 'rev-2', 'run-old')?.id).toBe('run-old');
    expect(runToShow(runs, 'rev-2', 'run-busy')?.id).toBe('run-new');
    expect(runToShow(runs, 'rev-2', 'run-rev-1')?.id).toBe('run-new');
  });

  it('shows no run on a revision without finished runs', () => {
    expect(runToShow([RUNNING], 'rev-2', null)).toBeNull();
  });
});

describe('revisionToOpen', () => {
  it("opens the linked run's revision, else the newest ready one", () => {
    const revisions = [REV_2, REV_1];
    expect(revisionToOpen(revisions, [ON_REV_1, NEW_RUN], 'run-rev-1')?.id).toBe('rev-1');
    expect(revisionToOpen(revisions, [ON_REV_1, NEW_RUN], null)?.id).toBe('rev-2');
    expect(revisionToOpen(revisions, [ON_REV_1], 'no-such-run')?.id).toBe('rev-2');
  });

  it('falls back to the newest ready revision when the linked run is on one still ingesting', () => {
    const onBusy = run({ id: 'run-3', modelRevision: { ...TEST_RUN.modelRevision, id: 'rev-3', number: 3 } });
    expect(revisionToOpen([REV_3_INGESTING, REV_2], [onBusy], 'run-3')?.id).toBe('rev-2');
  });
});

describe('viewerMembers', () => {
  const girder: MemberLabelRow = ['0aaaaaaaaaaaaaaaaaaaaa', 'G-1', 'IPE 300', 'Level 1'];
  const beam: MemberLabelRow = ['0bbbbbbbbbbbbbbbbbbbbb', 'B-2', 'IPE 200', 'Level 2'];

  it('takes names from the labels and results from the colours', () => {
    const colours = { members: { [girder[0]]: { u: 1.12, s: 'fail' as const } } };
    expect(viewerMembers([girder, beam], colours)).toEqual([
      { globalId: girder[0], tag: 'G-1', section: 'IPE 300', storey: 'Level 1', utilisationRatio: 1.12, status: 'fail' },
      { globalId: beam[0], tag: 'B-2', section: 'IPE 200', storey: 'Level 2', utilisationRatio: null, status: 'not-checked' },
    ]);
  });

  it('marks every member not checked without a run', () => {
    expect(viewerMembers([girder], null).map((m) => [m.status, m.utilisationRatio])).toEqual([['not-checked', null]]);
  });

  it('still colours results whose member labels have not arrived', () => {
    const colours = { members: { '0ccccccccccccccccccccc': { u: 0.4, s: 'pass' as const } } };
    expect(viewerMembers([], colours)).toEqual([
      { globalId: '0ccccccccccccccccccccc', tag: null, section: null, storey: null, utilisationRatio: 0.4, status: 'pass' },
    ]);
  });
});

});

describe('viewpointOfFinding', () => {
  it("uses the finding's own viewpoint", () => {
    const viewpoint = {
      camera: CAMERA,
      selectedGlobalIds: ['0aaaaaaaaaaaaaaaaaaaaa'],
      visibility: { defaultVisible: false, exceptionGlobalIds: ['0aaaaaaaaaaaaaaaaaaaaa'] },
      clippingPlanes: [PLANE],
    };
    expect(viewpointOfFinding(testFinding({ viewpoint }))).toEqual(viewpoint);
  });

  it('selects the members of a finding raised without a view, everything visible', () => {
    expect(viewpointOfFinding(testFinding({ viewpoint: null, memberGlobalIds: ['2O2Fr$t4X7Zf8NOew3FLOH'] }))).toEqual({
      selectedGlobalIds: ['2O2Fr$t4X7Zf8NOew3FLOH'],
      visibility: { defaultVisible: true, exceptionGlobalIds: [] },
      clippingPlanes: [],
    });
  });

  it('takes a viewpoint without clipping planes or camera', () => {
    const viewpoint = { selectedGlobalIds: [], visibility: { defaultVisible: true, exceptionGlobalIds: [] } };
    expect(viewpointOfFinding(testFinding({ viewpoint }))).toEqual({ ...viewpoint, clippingPlanes: [] });
  });
});

describe('saved viewpoints', () => {
  const members = ['0aaaaaaaaaaaaaaaaaaaaa', '0bbbbbbbbbbbbbbbbbbbbb', '0ccccccccccccccccccccc'];
  const base: ViewerViewpoint & { camera: ViewerCamera } = {
    camera: CAMERA,
    selectedGlobalIds: ['0aaaaaaaaaaaaaaaaaaaaa'],
    visibility: { defaultVisible: true, exceptionGlobalIds: [] },
    clippingPlanes: [PLANE],
  };

  it('saves "everything visible" as no list, with the name trimmed and the first cut', () => {
    expect(savedViewpointRequest('  North bay  ', base, members)).toEqual({
      name: 'North bay',
      camera: CAMERA,
      visibleGlobalIds: null,
      selectedGlobalIds: ['0aaaaaaaaaaaaaaaaaaaaa'],
      sectionPlane: PLANE,
    });
  });

  it('lists the members left visible when some are hidden, and the shown ones when only some are', () => {
    const hidden = { ...base, visibility: { defaultVisible: true, exceptionGlobalIds: ['0bbbbbbbbbbbbbbbbbbbbb'] } };
    expect(savedViewpointRequest('v', hidden, members).visibleGlobalIds).toEqual(['0aaaaaaaaaaaaaaaaaaaaa', '0ccccccccccccccccccccc']);
    const isolated = { ...base, visibility: { defaultVisible: false, exceptionGlobalIds: ['0ccccccccccccccccccccc'] } };
    expect(savedViewpointRequest('v', isolated, members).visibleGlobalIds).toEqual(['0ccccccccccccccccccccc']);
  });

  it('reopens a saved view as it was saved', () => {
    const request = savedViewpointRequest('v', { ...base, visibility: { defaultVisible: false, exceptionGlobalIds: ['0ccccccccccccccccccccc'] } }, members);
    const saved = { ...request, id: 'vp-1', createdById: 'user-engineer', createdAt: '2026-03-05T10:00:00Z' };
    expect(viewpointOfSaved(saved)).toEqual({
      camera: CAMERA,
      selectedGlobalIds: ['0aaaaaaaaaaaaaaaaaaaaa'],
      visibility: { defaultVisible: false, exceptionGlobalIds: ['0ccccccccccccccccccccc'] },
      clippingPlanes: [PLANE],
    });
    expect(viewpointOfSaved({ ...saved, visibleGlobalIds: null, sectionPlane: null })).toMatchObject({
      visibility: { defaultVisible: true, exceptionGlobalIds: [] },
      clippingPlanes: [],
    });
  });
});

describe('base64OfBytes', () => {
  it('matches Node’s base64 encoder (RFC 4648), also beyond one chunk', () => {
    const png = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(base64OfBytes(png)).toBe('iVBORw0KGgo=');
    const large = Uint8Array.from({ length: 100_001 }, (_, i) => (i * 7919) % 256);
    expect(base64OfBytes(large)).toBe(Buffer.from(large).toString('base64'));
  });
});
