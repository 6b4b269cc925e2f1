/**
 * The plain data every findings export reads (BCF, CSV, PDF findings table). The findings workflow maps its entities
 * to this shape; exporters never touch the database.
 */

export const FINDING_STATUSES = ['open', 'in_progress', 'resolved', 'ready_to_verify', 'verified', 'accepted'] as const;
export type FindingStatus = (typeof FINDING_STATUSES)[number];

/** The words people see, and the TopicStatus values written to BCF. */
export const FINDING_STATUS_LABELS: Readonly<Record<FindingStatus, string>> = {
  open: 'Open',
  in_progress: 'In progress',
  resolved: 'Resolved',
  ready_to_verify: 'Ready to verify',
  verified: 'Verified',
  accepted: 'Accepted',
};

export const FINDING_PRIORITIES = ['critical', 'high', 'normal', 'low'] as const;
export type FindingPriority = (typeof FINDING_PRIORITIES)[number];

export const FINDING_PRIORITY_LABELS: Readonly<Record<FindingPriority, string>> = {
  critical: 'Critical',
  high: 'High',
  normal: 'Normal',
  low: 'Low',
};

/**
 * Why the finding exists: a failing web, a web close to capacity, check flags that need an engineer's look, or a
 * reviewer's own note.
 */
export const FINDING_KINDS = ['failure', 'warning', 'flag', 'manual'] as const;
export type FindingKind = (typeof FINDING_KINDS)[number];

/** Written to BCF as TopicType. */
export const FINDING_KIND_LABELS: Readonly<Record<FindingKind, string>> = {
  failure: 'Web shear failure',
  warning: 'Check warning',
  flag: 'Check flags to review',
  manual: 'Manual finding',
};

/** Labels and user lists as exported: trimmed, blanks dropped, each value once in first-seen order. */
export function distinctValues(values: readonly string[]): string[] {
  return [...new Set(values.map((value) => value.trim()).filter((value) => value !== ''))];
}

export interface FindingComment {
  /** UUID, stable across exports so a re-import can tell new comments from known ones. */
  guid: string;
  /** E-mail address (BCF recommends user ids in e-mail form). */
  author: string;
  /** ISO 8601 date-time. */
  date: string;
  text: string;
  modifiedDate?: string;
  modifiedAuthor?: string;
}

/** A point or direction in IFC model coordinates: metres, Z up (the BCF convention). */
export type ModelVector = readonly [x: number, y: number, z: number];

export interface PerspectiveCamera {
  kind: 'perspective';
  viewPoint_m: ModelVector;
  direction: ModelVector;
  up: ModelVector;
  /** Vertical field of view. */
  fieldOfView_deg: number;
  /** Width / height of the view. */
  aspectRatio: number;
}

export interface OrthogonalCamera {
  kind: 'orthogonal';
  viewPoint_m: ModelVector;
  direction: ModelVector;
  up: ModelVector;
  /** Visible height of the view. */
  viewToWorldScale_m: number;
  aspectRatio: number;
}

export type FindingCamera = PerspectiveCamera | OrthogonalCamera;

export interface ClippingPlane {
  location_m: ModelVector;
  /** Plane normal; BCF defines it as pointing towards the side that is cut away. */
  direction: ModelVector;
}

export interface FindingViewpoint {
  /** UUID; when absent a stable one is derived from the topic GUID. */
  guid?: string;
  camera?: FindingCamera;
  /** IFC GlobalIds (22-character form) shown selected. */
  selectedGlobalIds: readonly string[];
  visibility: { defaultVisible: boolean; exceptionGlobalIds: readonly string[] };
  clippingPlanes?: readonly ClippingPlane[];
}

/** Why a finding was accepted as it is, who accepted it and when. */
export interface FindingAcceptance {
  justification: string;
  /** E-mail address, as comment authors are written. */
  author: string;
  /** ISO 8601 date-time. */
  date: string;
}

export interface FindingExport {
  /** Our reference shown to people (e.g. "F-0042"). */
  id: string;
  /** BCF topic UUID, stable across exports. */
  guid: string;
  kind: FindingKind;
  title: string;
  description?: string;
  status: FindingStatus;
  priority: FindingPriority;
  assigneeEmail?: string;
  labels: readonly string[];
  /** ISO 8601 date or date-time. */
  dueDate?: string;
  createdAt: string;
  createdBy: string;
  modifiedAt?: string;
  modifiedBy?: string;
  comments: readonly FindingComment[];
  /** Present while the status is accepted: every export carries the reason beside the status. */
  acceptance?: FindingAcceptance;
  /** IFC GlobalIds of the members the finding is about. */
  memberGlobalIds: readonly string[];
  /** How people name the member(s), e.g. "B-204 · IPE 300 · Level 2". */
  memberLabel?: string;
  /** Governing demand / capacity of the member when the finding was raised (1 = 100 %). */
  utilisation?: number;
  /** The view the finding was raised in; without one, exports select the members with everything visible. */
  viewpoint?: FindingViewpoint;
  snapshotPng?: Uint8Array;
}
