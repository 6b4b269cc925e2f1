/**
 * What a BCF file brought back from another tool changes (the round trip): the status of each known topic and the
 * comments whose GUIDs are new. Titles, viewpoints and the rest stay as Taulens has them. Every status change is
 * checked against the workflow table for the importing user's role; one problem anywhere refuses the whole file.
 * Accepting needs a written justification, which BCF has no place for, so acceptance is only ever done in Taulens;
 * resolving a failing finding needs a note of what was done, which a new comment of the topic in the file gives.
 */
import type { Action } from '../auth/permissions';
import { DomainError } from '../http/errors';
import type { ImportedTopic } from './bcf/bcf-import';
import { FINDING_LIMITS, type FindingKind, type FindingStatus, findingReference } from './finding-fields';
import { fromExportStatus, statusLabel } from './finding-export-view';
import { checkTransition } from './finding-workflow';
import { FINDING_STATUS_LABELS } from './export/finding-export';

/** A finding as the import compares it. */
export interface ImportTarget {
  id: string;
  number: number;
  guid: string;
  status: FindingStatus;
  kind: FindingKind;
}

export interface PlannedStatusChange {
  findingId: string;
  from: FindingStatus;
  to: FindingStatus;
  /** Leaving Accepted clears the justification. */
  clearsJustification: boolean;
}

export interface PlannedComment {
  findingId: string;
  guid: string;
  authorEmail: string;
  text: string;
  createdAt: Date;
}

export interface ImportProblem {
  topicGuid: string;
  finding: string;
  message: string;
}

export interface BcfImportPlan {
  statusChanges: PlannedStatusChange[];
  comments: PlannedComment[];
  /** Known topics with nothing new. */
  unchanged: number;
  problems: ImportProblem[];
  warnings: string[];
}

const OUR_STATUS_LABELS = Object.values(FINDING_STATUS_LABELS).join(', ');

function statusChangeOf(topic: ImportedTopic, target: ImportTarget, note: string, grants: (action: Action) => boolean): PlannedStatusChange | string | null {
  if (topic.status === undefined) return null;
  if (topic.statusId === undefined) {
    return `its status "${topic.status}" is not one Taulens uses (${OUR_STATUS_LABELS}).`;
  }
  const to = fromExportStatus(topic.statusId);
  if (to === target.status) return null;
  if (to === 'accepted') {
    return `it is marked ${statusLabel(to)} in the file; accept findings in Taulens, where a written justification is asked for.`;
  }
  try {
    checkTransition({ from: target.status, to, note, failing: target.kind === 'web-shear-fail' }, grants);
  } catch (error) {
    if (error instanceof DomainError) return error.message;
    throw error;
  }
  return { findingId: target.id, from: target.status, to, clearsJustification: target.status === 'accepted' };
}

/**
 * `targets` by lower-case topic GUID (every topic is known: unknown ones were refused before); `knownCommentGuids`
 * holds every comment GUID already stored, in any project.
 */
export function planBcfImport(
  topics: readonly ImportedTopic[],
  targets: ReadonlyMap<string, ImportTarget>,
  knownCommentGuids: ReadonlySet<string>,
  grants: (action: Action) => boolean,
  now = new Date(),
): BcfImportPlan {
  const plan: BcfImportPlan = { statusChanges: [], comments: [], unchanged: 0, problems: [], warnings: [] };
  const seenComments = new Set<string>();
  for (const topic of topics) {
    const target = targets.get(topic.guid);
    if (!target) throw new Error(`topic ${topic.guid} is not among the targets`);
    const finding = findingReference(target.number);
    const problem = (message: string) => plan.problems.push({ topicGuid: topic.guid, finding, message: `${finding}: ${message}` });

    let added = 0;
    for (const comment of topic.comments) {
      if (knownCommentGuids.has(comment.guid) || seenComments.has(comment.guid)) continue;
      seenComments.add(comment.guid);
      const text = comment.text.trim();
      if (text === '') {
        plan.warnings.push(`${finding}: an empty comment (${comment.guid}) was left out.`);
        continue;
      }
      if (text.length > FINDING_LIMITS.comment) {
        problem(`comment ${comment.guid} is longer than ${FINDING_LIMITS.comment} characters.`);
        continue;
      }
      const author = comment.author.trim().toLowerCase().slice(0, 254) || 'unknown';
      const createdAt = comment.date === '' ? now : new Date(comment.date);
      plan.comments.push({ findingId: target.id, guid: comment.guid, authorEmail: author, text, createdAt });
      added++;
    }
    const note = plan.comments.slice(plan.comments.length - added).map((comment) => comment.text).join('\n');
    const change = statusChangeOf(topic, target, note, grants);
    if (typeof change === 'string') problem(change);
    else if (change) plan.statusChanges.push(change);
    if (change === null && added === 0) plan.unchanged++;
  }
  return plan;
}
