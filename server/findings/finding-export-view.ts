/**
 * Findings as the exporters read them (export/finding-export.ts). The API spells statuses and kinds as the wave-2
 * contract does; the exporters keep their own ids, so the two vocabularies meet only here.
 */
import {
  FINDING_STATUS_LABELS,
  type FindingComment as ExportComment,
  type FindingExport,
  type FindingKind as ExportKind,
  type FindingStatus as ExportStatus,
} from './export/finding-export';
import type { AcceptanceRecord } from './finding-acceptance';
import type { FindingComment } from './finding-comment.entity';
import { type FindingKind, type FindingStatus, findingReference } from './finding-fields';
import type { Finding } from './finding.entity';

const EXPORT_STATUS: Readonly<Record<FindingStatus, ExportStatus>> = {
  open: 'open',
  'in-progress': 'in_progress',
  resolved: 'resolved',
  'ready-to-verify': 'ready_to_verify',
  verified: 'verified',
  accepted: 'accepted',
};

const EXPORT_KIND: Readonly<Record<FindingKind, ExportKind>> = {
  'web-shear-fail': 'failure',
  'web-shear-warning': 'warning',
  flag: 'flag',
  manual: 'manual',
};

const STATUS_BY_EXPORT = new Map(Object.entries(EXPORT_STATUS).map(([ours, theirs]) => [theirs, ours as FindingStatus]));

export function toExportStatus(status: FindingStatus): ExportStatus {
  return EXPORT_STATUS[status];
}

export function fromExportStatus(status: ExportStatus): FindingStatus {
  const ours = STATUS_BY_EXPORT.get(status);
  if (!ours) throw new Error(`no finding status for export status ${status}`);
  return ours;
}

/** "Ready to verify": the words people read, the same as BCF's TopicStatus. */
export function statusLabel(status: FindingStatus): string {
  return FINDING_STATUS_LABELS[EXPORT_STATUS[status]];
}

/** A finding with what the exporters need beside its own row. */
export interface FindingForExport {
  finding: Finding;
  comments: readonly FindingComment[];
  snapshotPng?: Buffer;
  /** Who accepted it and when (finding-acceptance.ts), for an accepted finding. */
  accepted?: AcceptanceRecord;
}

/** Who created it: the user's e-mail, or the product for findings a check run raised. */
const SYSTEM_AUTHOR = 'taulens@localhost';

function toExportComment(comment: FindingComment): ExportComment {
  return { guid: comment.guid, author: comment.author?.email ?? comment.authorEmail, date: comment.createdAt.toISOString(), text: comment.text };
}

/** The reason of an accepted finding; one accepted without a history row shows the system on its last change. */
function acceptanceOf(finding: Finding, accepted: AcceptanceRecord | undefined): FindingExport['acceptance'] {
  if (finding.status !== 'accepted' || !finding.justification) return undefined;
  return {
    justification: finding.justification,
    author: accepted?.email ?? SYSTEM_AUTHOR,
    date: (accepted?.at ?? finding.updatedAt).toISOString(),
  };
}

export function toFindingExport({ finding, comments, snapshotPng, accepted }: FindingForExport): FindingExport {
  const modified = finding.updatedAt.getTime() > finding.createdAt.getTime();
  return {
    id: findingReference(finding.number),
    guid: finding.guid,
    kind: EXPORT_KIND[finding.kind],
    title: finding.title,
    description: finding.description || undefined,
    status: EXPORT_STATUS[finding.status],
    priority: finding.priority,
    assigneeEmail: finding.assignee?.email,
    labels: finding.labels,
    dueDate: finding.dueDate ?? undefined,
    createdAt: finding.createdAt.toISOString(),
    createdBy: finding.createdBy?.email ?? SYSTEM_AUTHOR,
    modifiedAt: modified ? finding.updatedAt.toISOString() : undefined,
    comments: comments.map(toExportComment),
    acceptance: acceptanceOf(finding, accepted),
    memberGlobalIds: finding.memberGlobalIds,
    memberLabel: finding.memberLabel ?? undefined,
    utilisation: finding.utilisation ?? undefined,
    viewpoint: finding.viewpoint ?? undefined,
    snapshotPng,
  };
}
