/**
 * The JSON of the findings API, requests and answers. Pure types with no entity behind them, so the client reads
 * the same shapes (src/app/findings/finding.ts).
 */
import type { ClippingPlane, FindingCamera, FindingViewpoint } from './export/finding-export';
import type { ChangeSource, FindingKind, FindingPriority, FindingStatus } from './finding-fields';

export interface PersonRef {
  id: string | null;
  name: string;
}

export interface FindingView {
  id: string;
  guid: string;
  number: number;
  kind: FindingKind;
  title: string;
  description: string;
  status: FindingStatus;
  priority: FindingPriority;
  assignee: { id: string; name: string; email: string } | null;
  dueDate: string | null;
  labels: string[];
  memberGlobalIds: string[];
  memberTag: string | null;
  runId: string | null;
  utilisation: number | null;
  justification: string | null;
  viewpoint: FindingViewpoint | null;
  hasSnapshot: boolean;
  /** Null when a check run raised it. */
  createdBy: PersonRef | null;
  createdAt: string;
  updatedAt: string;
}

/** `GET …/findings`: one page of the list and how many match. */
export interface FindingPageView {
  total: number;
  findings: FindingView[];
}

export interface CommentView {
  id: string;
  guid: string;
  author: PersonRef;
  text: string;
  createdAt: string;
}

export interface ChangeView {
  id: string;
  /** `{id: null, name: 'System'}` for changes a check run made. */
  actor: PersonRef;
  source: ChangeSource;
  field: string;
  from: string | null;
  to: string | null;
  at: string;
}

export interface FindingDetailView {
  finding: FindingView;
  comments: CommentView[];
  history: ChangeView[];
  /** The statuses the caller may move this finding to now. */
  allowedTransitions: FindingStatus[];
}

export interface SavedViewpointView {
  id: string;
  name: string;
  camera: FindingCamera;
  visibleGlobalIds: string[] | null;
  selectedGlobalIds: string[];
  sectionPlane: ClippingPlane | null;
  createdById: string | null;
  createdAt: string;
}

/** `POST …/findings`, raised by hand (usually from the 3D view); the server fills in the defaults. */
export interface NewFindingRequest {
  title: string;
  description?: string;
  memberGlobalIds: string[];
  viewpoint?: FindingViewpoint;
  /** PNG, base64 without a data: prefix. */
  snapshotPng?: string;
  priority?: FindingPriority;
  labels?: string[];
}

/** `PATCH …/findings/:findingId`: only the fields to change. */
export interface FindingPatch {
  priority?: FindingPriority;
  dueDate?: string | null;
  labels?: string[];
  assigneeId?: string | null;
  title?: string;
  description?: string;
}

/** What `POST …/findings/import` changed. */
export interface BcfImportSummary {
  version: '2.1' | '3.0';
  topics: number;
  statusChanges: number;
  commentsAdded: number;
  unchanged: number;
  warnings: string[];
}
