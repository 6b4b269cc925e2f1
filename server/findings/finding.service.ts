/**
 * The findings workflow: list, read, raise by hand, edit, change status, comment, assign. Every change is written
 * with its history rows in one transaction; e-mails go out after it has been committed.
 */
import { randomUUID } from 'node:crypto';
import { type DataSource, type EntityManager, In } from 'typeorm';
import { type Action, type ProjectAccess, can } from '../auth/permissions';
import { runTransaction } from '../data-source';
import { ForbiddenError, NotFoundError, ValidationError } from '../http/errors';
import { ProjectMember } from '../projects/project-member.entity';
import type { FileStorage } from '../storage/file-storage';
import type { FindingNotice, NoticeSink } from '../notifications/finding-notifier';
import type { FindingPageView, FindingPatch, NewFindingRequest } from './finding-api-types';
import { FindingChange } from './finding-change.entity';
import { FindingComment } from './finding-comment.entity';
import { FINDING_LIMITS, type FindingStatus } from './finding-fields';
import { type ChangeActor, type ChangeEntry, recordChanges } from './finding-history';
import { mentionedMembers } from './finding-mentions';
import { filteredFindings, sortedPage } from './finding-query';
import type { FindingListQuery } from './finding-requests';
import { checkTransition, allowedTransitions } from './finding-workflow';
import { Finding } from './finding.entity';
import {
  type CommentView,
  type FindingDetailView,
  type FindingView,
  toChangeView,
  toCommentView,
  toFindingView,
} from './finding-views';

/** Who is acting, as the session knows them. */
export interface FindingActor {
  id: string;
  name: string;
  email: string;
}

export type FindingAccess = ProjectAccess & { projectId: string };

/** A new finding as the route parsed it, defaults filled in. */
export type NewFinding = Required<Pick<NewFindingRequest, 'title' | 'description' | 'memberGlobalIds' | 'priority' | 'labels'>> &
  Pick<NewFindingRequest, 'viewpoint' | 'snapshotPng'>;

/** Triage fields belong to whoever assigns; wording and labels to anyone taking part (the route's guard). */
const PATCH_ACTIONS: Readonly<Partial<Record<keyof FindingPatch, Action>>> = {
  assigneeId: 'finding.assign',
  priority: 'finding.assign',
  dueDate: 'finding.assign',
};

const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

export function snapshotKeyOf(projectId: string, findingId: string): string {
  return `projects/${projectId}/findings/${findingId}/snapshot.png`;
}

function userChange(actor: FindingActor): ChangeActor {
  return { id: actor.id, source: 'user' };
}

function grantsOf(access: FindingAccess): (action: Action) => boolean {
  return (action) => can(access, action);
}

function decodeSnapshot(base64: string): Buffer {
  const png = Buffer.from(base64, 'base64');
  if (png.length > FINDING_LIMITS.snapshotBytes) {
    throw new ValidationError(`The snapshot is larger than ${FINDING_LIMITS.snapshotBytes / 1024} KiB.`, {
      code: 'snapshot_too_large',
      details: [{ location: 'body', field: 'snapshotPng', message: 'is too large' }],
    });
  }
  if (!png.subarray(0, 8).equals(PNG_SIGNATURE)) {
    throw new ValidationError('The snapshot is not a PNG image.', {
      code: 'snapshot_not_png',
      details: [{ location: 'body', field: 'snapshotPng', message: 'is not a PNG image' }],
    });
  }
  return png;
}

async function loadFinding(manager: EntityManager, projectId: string, findingId: string): Promise<Finding> {
  const finding = await manager.findOne(Finding, { where: { id: findingId, projectId }, relations: { assignee: true, createdBy: true } });
  if (!finding) throw new NotFoundError('There is no such finding in this project.', { code: 'finding_not_found' });
  return finding;
}

/** The project member, or a 400 naming the field: findings are only assigned to members. */
async function requireMember(manager: EntityManager, projectId: string, userId: string): Promise<ProjectMember & { user: NonNullable<ProjectMember['user']> }> {
  const member = await manager.findOne(ProjectMember, { where: { projectId, userId }, relations: { user: true } });
  if (!member?.user || !member.user.active) {
    throw new ValidationError('Findings can only be assigned to active members of the project.', {
      code: 'assignee_not_member',
      details: [{ location: 'body', field: 'assigneeId', message: 'is not an active member of this project' }],
    });
  }
  return member as ProjectMember & { user: NonNullable<ProjectMember['user']> };
}

async function insertComment(manager: EntityManager, findingId: string, text: string, actor: FindingActor): Promise<string> {
  const id = randomUUID();
  await manager.insert(FindingComment, { id, findingId, guid: randomUUID(), authorId: actor.id, authorEmail: actor.email, text, createdAt: new Date() });
  return id;
}

async function nextNumber(manager: EntityManager, projectId: string): Promise<number> {
  return ((await manager.maximum(Finding, 'number', { projectId })) ?? 0) + 1;
}

export class FindingService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly storage: FileStorage,
    private readonly notifier: NoticeSink,
  ) {}

  async list(projectId: string, query: FindingListQuery, me: string): Promise<FindingPageView> {
    const manager = this.dataSource.manager;
    const total = await filteredFindings(manager, projectId, query, me).getCount();
    const rows = await sortedPage(filteredFindings(manager, projectId, query, me), query.sort, query.dir, query.page, query.pageSize).getMany();
    return { total, findings: rows.map(toFindingView) };
  }

  async detail(projectId: string, findingId: string, access: FindingAccess): Promise<FindingDetailView> {
    const manager = this.dataSource.manager;
    const finding = await loadFinding(manager, projectId, findingId);
    const [comments, history] = await Promise.all([
      manager.find(FindingComment, { where: { findingId }, relations: { author: true }, order: { createdAt: 'ASC' } }),
      manager.find(FindingChange, { where: { findingId }, relations: { actor: true }, order: { at: 'ASC' } }),
    ]);
    return {
      finding: toFindingView(finding),
      comments: comments.map(toCommentView),
      history: history.map(toChangeView),
      allowedTransitions: allowedTransitions(finding.status, grantsOf(access)),
    };
  }

  /** A finding raised by hand, usually from the 3D view with its viewpoint and snapshot. */
  async create(projectId: string, input: NewFinding, actor: FindingActor): Promise<FindingView> {
    const id = randomUUID();
    const png = input.snapshotPng === undefined ? undefined : decodeSnapshot(input.snapshotPng);
    const snapshotKey = png ? snapshotKeyOf(projectId, id) : null;
    // The file first: a finding never points at a snapshot that is not there; a failed insert removes the file.
    if (png && snapshotKey) await this.storage.put(snapshotKey, png, { maxBytes: FINDING_LIMITS.snapshotBytes });
    try {
      await runTransaction(this.dataSource, async (manager) => {
        await manager.insert(Finding, {
          id,
          projectId,
          number: await nextNumber(manager, projectId),
          guid: randomUUID(),
          kind: 'manual',
          title: input.title,
          description: input.description,
          priority: input.priority,
          labels: input.labels,
          memberGlobalIds: input.memberGlobalIds,
          memberKey: null,
          viewpoint: input.viewpoint ?? null,
          snapshotKey,
          createdById: actor.id,
        });
        await recordChanges(manager, userChange(actor), [{ findingId: id, field: 'created', from: null, to: 'open' }]);
      });
    } catch (error) {
      if (snapshotKey) await this.storage.delete(snapshotKey);
      throw error;
    }
    return toFindingView(await loadFinding(this.dataSource.manager, projectId, id));
  }

  async update(projectId: string, findingId: string, patch: FindingPatch, access: FindingAccess, actor: FindingActor): Promise<FindingView> {
    for (const [field, action] of Object.entries(PATCH_ACTIONS) as [keyof FindingPatch, Action][]) {
      if (patch[field] !== undefined && !can(access, action)) {
        throw new ForbiddenError(`Your role in this project does not allow changing ${field} (${action}).`, { code: 'field_not_allowed' });
      }
    }
    const notices: FindingNotice[] = [];
    await runTransaction(this.dataSource, async (manager) => {
      const finding = await loadFinding(manager, projectId, findingId);
      const changes: Partial<Finding> = {};
      const history: ChangeEntry[] = [];
      const note = (field: keyof FindingPatch & keyof Finding, from: string | null, to: string | null) => {
        history.push({ findingId, field, from, to });
      };
      if (patch.assigneeId !== undefined && patch.assigneeId !== finding.assigneeId) {
        const member = patch.assigneeId === null ? null : await requireMember(manager, projectId, patch.assigneeId);
        changes.assigneeId = patch.assigneeId;
        history.push({ findingId, field: 'assignee', from: finding.assignee?.name ?? null, to: member?.user.name ?? null });
        if (patch.assigneeId !== null) notices.push({ kind: 'assigned', projectId, findingIds: [findingId], assigneeId: patch.assigneeId, actorId: actor.id });
      }
      if (patch.priority !== undefined && patch.priority !== finding.priority) {
        changes.priority = patch.priority;
        note('priority', finding.priority, patch.priority);
      }
      if (patch.dueDate !== undefined && patch.dueDate !== finding.dueDate) {
        changes.dueDate = patch.dueDate;
        note('dueDate', finding.dueDate, patch.dueDate);
      }
      if (patch.labels !== undefined && patch.labels.join('\n') !== finding.labels.join('\n')) {
        changes.labels = patch.labels;
        note('labels', finding.labels.join(', ') || null, patch.labels.join(', ') || null);
      }
      if (patch.title !== undefined && patch.title !== finding.title) {
        changes.title = patch.title;
        note('title', finding.title, patch.title);
      }
      if (patch.description !== undefined && patch.description !== finding.description) {
        changes.description = patch.description;
        note('description', finding.description || null, patch.description || null);
      }
      if (history.length === 0) return;
      await manager.update(Finding, findingId, changes);
      await recordChanges(manager, userChange(actor), history);
    });
    await this.notifier.deliver(notices);
    return toFindingView(await loadFinding(this.dataSource.manager, projectId, findingId));
  }

  async transition(
    projectId: string,
    findingId: string,
    request: { to: FindingStatus; justification?: string; note?: string },
    access: FindingAccess,
    actor: FindingActor,
  ): Promise<FindingView> {
    const notice = await runTransaction(this.dataSource, async (manager): Promise<FindingNotice> => {
      const finding = await loadFinding(manager, projectId, findingId);
      const from = finding.status;
      const failing = finding.kind === 'web-shear-fail';
      const justification = checkTransition({ from, to: request.to, justification: request.justification, note: request.note, failing }, grantsOf(access));
      await manager.update(Finding, findingId, { status: request.to, justification });
      if (request.note) await insertComment(manager, findingId, request.note, actor);
      const history: ChangeEntry[] = [{ findingId, field: 'status', from, to: request.to }];
      if (justification !== null || finding.justification !== null) {
        history.push({ findingId, field: 'justification', from: finding.justification, to: justification });
      }
      await recordChanges(manager, userChange(actor), history);
      return { kind: 'status-changed', projectId, findingId, from, to: request.to, actorId: actor.id, justification };
    });
    await this.notifier.deliver([notice]);
    return toFindingView(await loadFinding(this.dataSource.manager, projectId, findingId));
  }

  async addComment(projectId: string, findingId: string, text: string, actor: FindingActor): Promise<CommentView> {
    const { commentId, mentionedIds } = await runTransaction(this.dataSource, async (manager) => {
      await loadFinding(manager, projectId, findingId);
      const commentId = await insertComment(manager, findingId, text, actor);
      const members = await manager.find(ProjectMember, { where: { projectId }, relations: { user: true } });
      const people = members.flatMap((m) => (m.user ? [m.user] : []));
      return { commentId, mentionedIds: mentionedMembers(text, people).map((user) => user.id) };
    });
    if (mentionedIds.length > 0) {
      await this.notifier.deliver([{ kind: 'mentioned', projectId, findingId, mentionedIds, actorId: actor.id, text }]);
    }
    const comment = await this.dataSource.manager.findOneOrFail(FindingComment, { where: { id: commentId }, relations: { author: true } });
    return toCommentView(comment);
  }

  /** Assigns (or unassigns, with null) several findings at once; all must belong to the project. */
  async bulkAssign(projectId: string, findingIds: string[], assigneeId: string | null, actor: FindingActor): Promise<FindingView[]> {
    const changedIds = await runTransaction(this.dataSource, async (manager) => {
      const member = assigneeId === null ? null : await requireMember(manager, projectId, assigneeId);
      const findings = await manager.find(Finding, { where: { id: In(findingIds), projectId }, relations: { assignee: true } });
      const missing = findingIds.filter((id) => !findings.some((finding) => finding.id === id));
      if (missing.length > 0) {
        throw new NotFoundError(`${missing.length} of the selected findings are not in this project; nothing was assigned.`, {
          code: 'finding_not_found',
          details: { findingIds: missing },
        });
      }
      const changed = findings.filter((finding) => finding.assigneeId !== assigneeId);
      if (changed.length === 0) return [];
      await manager.update(Finding, { id: In(changed.map((finding) => finding.id)) }, { assigneeId });
      await recordChanges(
        manager,
        userChange(actor),
        changed.map((finding) => ({ findingId: finding.id, field: 'assignee', from: finding.assignee?.name ?? null, to: member?.user.name ?? null })),
      );
      return changed.map((finding) => finding.id);
    });
    if (assigneeId !== null && changedIds.length > 0) {
      await this.notifier.deliver([{ kind: 'assigned', projectId, findingIds: changedIds, assigneeId, actorId: actor.id }]);
    }
    const findings = await this.dataSource.manager.find(Finding, {
      where: { id: In(findingIds), projectId },
      relations: { assignee: true, createdBy: true },
      order: { number: 'ASC' },
    });
    return findings.map(toFindingView);
  }

  async snapshot(projectId: string, findingId: string): Promise<Buffer> {
    const finding = await loadFinding(this.dataSource.manager, projectId, findingId);
    if (finding.snapshotKey === null) throw new NotFoundError('This finding has no snapshot.', { code: 'snapshot_not_found' });
    return this.storage.get(finding.snapshotKey);
  }
}
