// Client mirrors of the findings API's views (server/findings/finding-views.ts), whose files reach entity classes
// that the client build must not compile. The vocabulary itself is shared with the server.
import type { FindingKind, FindingPriority, FindingStatus } from '../../../server/findings/finding-fields';
import type { ViewerViewpoint } from '../viewer/viewpoint';

export type { FindingKind, FindingPriority, FindingStatus };
export { FINDING_KINDS, FINDING_STATUSES, findingReference } from '../../../server/findings/finding-fields';

export const STATUS_LABELS: Readonly<Record<FindingStatus, string>> = {
  open: 'Open',
  'in-progress': 'In progress',
  resolved: 'Resolved',
  'ready-to-verify': 'Ready to verify',
  verified: 'Verified',
  accepted: 'Accepted',
};

export const KIND_LABELS: Readonly<Record<FindingKind, string>> = {
  'web-shear-fail': 'Web over capacity',
  'web-shear-warning': 'Web close to capacity',
  flag: 'Flags to review',
  manual: 'Raised by hand',
};

/** Most severe first, as lists and menus show them. */
export const PRIORITIES: readonly FindingPriority[] = ['critical', 'high', 'normal', 'low'];

export const PRIORITY_LABELS: Readonly<Record<FindingPriority, string>> = {
  critical: 'Critical',
  high: 'High',
  normal: 'Normal',
  low: 'Low',
};

export interface PersonRef {
  /** Null for the system (a check run) or an imported author without an account. */
  id: string | null;
  name: string;
}

export interface Finding {
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
  /** Camera optional: findings raised by a check run are framed by the 3D view itself. */
  viewpoint: (Omit<ViewerViewpoint, 'camera'> & Partial<Pick<ViewerViewpoint, 'camera'>>) | null;
  hasSnapshot: boolean;
  createdBy: PersonRef | null;
  createdAt: string;
  updatedAt: string;
}

export interface FindingComment {
  id: string;
  guid: string;
  author: PersonRef;
  text: string;
  createdAt: string;
}

export interface FindingChange {
  id: string;
  actor: PersonRef;
  source: 'user' | 'system' | 'bcf-import';
  field: string;
  from: string | null;
  to: string | null;
  at: string;
}

/** `GET …/findings/:findingId` */
export interface FindingDetail {
  finding: Finding;
  comments: FindingComment[];
  history: FindingChange[];
  allowedTransitions: FindingStatus[];
}

/** `GET …/findings` */
export interface FindingsPage {
  total: number;
  findings: Finding[];
}

/** `PATCH …/findings/:findingId` */
export interface FindingPatch {
  priority?: FindingPriority;
  dueDate?: string | null;
  labels?: string[];
  assigneeId?: string | null;
  title?: string;
  description?: string;
}

/** `POST …/findings` (raised from the 3D view). */
export interface NewFinding {
  title: string;
  description?: string;
  memberGlobalIds: string[];
  viewpoint?: ViewerViewpoint;
  /** PNG, base64 without the data: prefix. */
  snapshotPng?: string;
  priority?: FindingPriority;
  labels?: string[];
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

export interface NotificationSettings {
  assigned: boolean;
  statusChanged: boolean;
  mentioned: boolean;
}

/** The button that moves a finding to each status (Ready to verify is reached through check runs only). */
export const MOVE_TO: Readonly<Record<FindingStatus, { label: string; icon: string }>> = {
  open: { label: 'Reopen', icon: 'undo' },
  'in-progress': { label: 'Start work', icon: 'construction' },
  resolved: { label: 'Mark resolved', icon: 'task_alt' },
  'ready-to-verify': { label: 'Ready to verify', icon: 'pending_actions' },
  verified: { label: 'Verify', icon: 'verified' },
  accepted: { label: 'Accept as is…', icon: 'gavel' },
};
