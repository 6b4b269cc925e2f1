/**
 * The 3D view page's data logic, kept free of Angular and the DOM: which revision and check run to show, the
 * members as the viewer takes them, and the conversions between the viewer's viewpoints and the API's.
 */
import type { CheckRun } from '../checks/checks-api';
import type { Finding } from '../findings/finding';
import type { MemberLabelRow, RevisionView } from '../models/models-api';
import type { SavedViewpointView } from '../../../server/findings/finding-api-types';
import type { MemberCheckStatus, ViewerMember } from './viewer-member';
import type { ViewerCamera, ViewerClippingPlane, ViewerViewpoint } from './viewpoint';

export type { SavedViewpointView };

/** `GET …/checks/:runId/colours`: utilisation ratio and status per GlobalId. */
export interface RunColours {
  members: Record<string, { u: number | null; s: MemberCheckStatus }>;
}

/** `POST …/viewpoints`. */
export interface SavedViewpointRequest {
  name: string;
  camera: ViewerCamera;
  /** Null when everything is visible. */
  visibleGlobalIds: string[] | null;
  selectedGlobalIds: string[];
  sectionPlane: ViewerClippingPlane | null;
}

/** The newest revision whose geometry is ready, or null. */
export function defaultRevision(revisions: readonly RevisionView[]): RevisionView | null {
  return revisions.filter((revision) => revision.status === 'ready').reduce<RevisionView | null>(
    (newest, revision) => (newest === null || revision.number > newest.number ? revision : newest),
    null,
  );
}

/** Finished runs on one revision, newest first: only they have results to colour with. */
export function finishedRunsOn(runs: readonly CheckRun[], revisionId: string | null): CheckRun[] {
  return runs
    .filter((run) => run.status === 'done' && run.modelRevision.id === revisionId)
    .sort((a, b) => runTime(b).localeCompare(runTime(a)));
}

function runTime(run: CheckRun): string {
  return run.finishedAt ?? run.createdAt;
}

/**
 * The revision to open: the one a linked run or finding's run was made on, else the newest ready one. A link to
 * a revision that is not ready (or not there) falls back to the newest ready one too.
 */
export function revisionToOpen(
  revisions: readonly RevisionView[],
  runs: readonly CheckRun[],
  linkedRunId: string | null,
): RevisionView | null {
  const linked = runs.find((run) => run.id === linkedRunId)?.modelRevision.id;
  const revision = revisions.find((candidate) => candidate.id === linked && candidate.status === 'ready');
  return revision ?? defaultRevision(revisions);
}

/** The run to colour with on a revision: the linked one when it is a finished run on it, else the latest finished. */
export function runToShow(runs: readonly CheckRun[], revisionId: string | null, linkedRunId: string | null): CheckRun | null {
  const finished = finishedRunsOn(runs, revisionId);
  return finished.find((run) => run.id === linkedRunId) ?? finished[0] ?? null;
}

/**
 * The members as the viewer takes them: names from the revision's member labels, results from the run's colours.
 * Without a run every member is "not checked". Results for members the labels do not (yet) name still colour.
 */
export function viewerMembers(labels: readonly MemberLabelRow[], colours: RunColours | null): ViewerMember[] {
  const results = colours?.members ?? {};
  const members: ViewerMember[] = labels.map(([globalId, tag, section, storey]) => {
    const result = results[globalId];
    return { globalId, tag, section, storey, utilisationRatio: result?.u ?? null, status: result?.s ?? 'not-checked' };
  });
  const named = new Set(labels.map(([globalId]) => globalId));
  for (const [globalId, result] of Object.entries(results)) {
    if (named.has(globalId)) continue;
    members.push({ globalId, tag: null, section: null, storey: null, utilisationRatio: result.u, status: result.s });
  }
  return members;
}

/**
 * A finding's view: its own viewpoint, or (raised by a check run without one) its members selected with everything
 * visible, which the viewer frames.
 */
export function viewpointOfFinding(finding: Pick<Finding, 'viewpoint' | 'memberGlobalIds'>): ViewerViewpoint {
  const viewpoint = finding.viewpoint;
  if (viewpoint === null) {
    return {
      selectedGlobalIds: [...finding.memberGlobalIds],
      visibility: { defaultVisible: true, exceptionGlobalIds: [] },
      clippingPlanes: [],
    };
  }
  return {
    ...(viewpoint.camera && { camera: viewpoint.camera }),
    selectedGlobalIds: [...viewpoint.selectedGlobalIds],
    visibility: {
      defaultVisible: viewpoint.visibility.defaultVisible,
      exceptionGlobalIds: [...viewpoint.visibility.exceptionGlobalIds],
    },
    clippingPlanes: [...(viewpoint.clippingPlanes ?? [])],
  };
}

/**
 * The request that saves the current view. Saved views list the visible elements rather than the hidden ones, so
 * "all but these" becomes the members left visible (context elements then hide when the view is reopened).
 */
export function savedViewpointRequest(
  name: string,
  viewpoint: ViewerViewpoint & { camera: ViewerCamera },
  memberGlobalIds: readonly string[],
): SavedViewpointRequest {
  const { defaultVisible, exceptionGlobalIds } = viewpoint.visibility;
  let visibleGlobalIds: string[] | null = [...exceptionGlobalIds];
  if (defaultVisible) {
    const hidden = new Set(exceptionGlobalIds);
    visibleGlobalIds = hidden.size === 0 ? null : memberGlobalIds.filter((globalId) => !hidden.has(globalId));
  }
  return {
    name: name.trim(),
    camera: viewpoint.camera,
    visibleGlobalIds,
    selectedGlobalIds: [...viewpoint.selectedGlobalIds],
    sectionPlane: viewpoint.clippingPlanes[0] ?? null,
  };
}

/** A saved view back in the viewer's terms. */
export function viewpointOfSaved(saved: SavedViewpointView): ViewerViewpoint {
  return {
    camera: saved.camera,
    selectedGlobalIds: [...saved.selectedGlobalIds],
    visibility:
      saved.visibleGlobalIds === null
        ? { defaultVisible: true, exceptionGlobalIds: [] }
        : { defaultVisible: false, exceptionGlobalIds: [...saved.visibleGlobalIds] },
    clippingPlanes: saved.sectionPlane === null ? [] : [saved.sectionPlane],
  };
}

/** PNG bytes as base64 without a data: prefix, as the findings API takes snapshots. */
export function base64OfBytes(bytes: Uint8Array): string {
  // Chunks keep String.fromCharCode under the engine's argument limit.
  const CHUNK = 0x8000;
  let binary = '';
  for (let start = 0; start < bytes.length; start += CHUNK) {
    binary += String.fromCharCode(...bytes.subarray(start, start + CHUNK));
  }
  return btoa(binary);
}
