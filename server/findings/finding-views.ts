/** Entities to the findings API's JSON (finding-api-types.ts): plain data, never entities. */
import type { ChangeView, CommentView, FindingView, PersonRef, SavedViewpointView } from './finding-api-types';
import type { FindingChange } from './finding-change.entity';
import type { FindingComment } from './finding-comment.entity';
import type { Finding } from './finding.entity';
import type { SavedViewpoint } from './saved-viewpoint.entity';

export type { ChangeView, CommentView, FindingDetailView, FindingView, PersonRef, SavedViewpointView } from './finding-api-types';

export const SYSTEM_ACTOR: PersonRef = { id: null, name: 'System' };

/** Expects `assignee` and `createdBy` loaded. */
export function toFindingView(finding: Finding): FindingView {
  const { assignee, createdBy } = finding;
  return {
    id: finding.id,
    guid: finding.guid,
    number: finding.number,
    kind: finding.kind,
    title: finding.title,
    description: finding.description,
    status: finding.status,
    priority: finding.priority,
    assignee: assignee ? { id: assignee.id, name: assignee.name, email: assignee.email } : null,
    dueDate: finding.dueDate,
    labels: finding.labels,
    memberGlobalIds: finding.memberGlobalIds,
    memberTag: finding.memberTag,
    runId: finding.runId,
    utilisation: finding.utilisation,
    justification: finding.justification,
    viewpoint: finding.viewpoint,
    hasSnapshot: finding.snapshotKey !== null,
    createdBy: createdBy ? { id: createdBy.id, name: createdBy.name } : null,
    createdAt: finding.createdAt.toISOString(),
    updatedAt: finding.updatedAt.toISOString(),
  };
}

/** Expects `author` loaded; imported comments by people without an account show their address. */
export function toCommentView(comment: FindingComment): CommentView {
  const author = comment.author ? { id: comment.author.id, name: comment.author.name } : { id: null, name: comment.authorEmail };
  return { id: comment.id, guid: comment.guid, author, text: comment.text, createdAt: comment.createdAt.toISOString() };
}

/** Expects `actor` loaded. */
export function toChangeView(change: FindingChange): ChangeView {
  return {
    id: change.id,
    actor: change.actor ? { id: change.actor.id, name: change.actor.name } : SYSTEM_ACTOR,
    source: change.source,
    field: change.field,
    from: change.fromValue,
    to: change.toValue,
    at: change.at.toISOString(),
  };
}

export function toSavedViewpointView(viewpoint: SavedViewpoint): SavedViewpointView {
  return {
    id: viewpoint.id,
    name: viewpoint.name,
    camera: viewpoint.camera,
    visibleGlobalIds: viewpoint.visibleGlobalIds,
    selectedGlobalIds: viewpoint.selectedGlobalIds,
    sectionPlane: viewpoint.sectionPlane,
    createdById: viewpoint.createdById,
    createdAt: viewpoint.createdAt.toISOString(),
  };
}
