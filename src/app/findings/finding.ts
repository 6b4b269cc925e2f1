// The findings API's vocabulary and JSON, shared with the server through files that reach no entity class (the
// client build must not compile those), and the words the pages use for them.
import type { FindingKind, FindingPriority, FindingStatus } from '../../../server/findings/finding-fields';

export type { FindingKind, FindingPriority, FindingStatus };
export type {
  BcfImportSummary,
  ChangeView as FindingChange,
  CommentView as FindingComment,
  FindingDetailView as FindingDetail,
  FindingPageView as FindingsPage,
  FindingPatch,
  FindingView as Finding,
  NewFindingRequest as NewFinding,
  PersonRef,
} from '../../../server/findings/finding-api-types';
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

export interface NotificationSettings {
  assigned: boolean;
  statusChanged: boolean;
  mentioned: boolean;
}

/** The button that moves a finding to each status (Ready to verify is reached through check runs only). */
const MOVE_TO: Readonly<Record<FindingStatus, { label: string; icon: string }>> = {
  open: { label: 'Reopen', icon: 'undo' },
  'in-progress': { label: 'Start work', icon: 'construction' },
  resolved: { label: 'Mark resolved', icon: 'task_alt' },
  'ready-to-verify': { label: 'Ready to verify', icon: 'pending_actions' },
  verified: { label: 'Verify', icon: 'verified' },
  accepted: { label: 'Accept as is…', icon: 'gavel' },
};

/** The button for a step, named for what it does from where the finding is: taking back a resolution reopens it. */
export function moveAction(from: FindingStatus, to: FindingStatus): { label: string; icon: string } {
  return from === 'resolved' && to === 'in-progress' ? MOVE_TO.open : MOVE_TO[to];
}
