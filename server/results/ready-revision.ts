/**
 * The model revision a results import, a matching or a check run works against: it must be ready (ingested), and its
 * members are read once and kept, since a ready revision never changes.
 */
import type { DataSource } from 'typeorm';
import { ConflictError, NotFoundError } from '../http/errors';
import type { MemberRecord } from '../ifc/model-read-result';
import { findRevision, loadMemberRecords, type RevisionView } from '../models/model-queries';
import { LruPromiseCache } from './lru-promise-cache';

/** Revisions whose members stay in memory per DataSource (a 20,000-member revision is some tens of MB). */
const KEPT_REVISIONS = 2;
const memberCaches = new WeakMap<DataSource, LruPromiseCache<string, MemberRecord[]>>();

export function revisionLabel(revision: Pick<RevisionView, 'number' | 'fileName'>): string {
  return `revision ${revision.number} (${revision.fileName})`;
}

/** The revision, or 404 when the project has none by that id and 409 `revision_not_ready` unless it is ready. */
export async function readyRevision(dataSource: DataSource, projectId: string, revisionId: string): Promise<RevisionView> {
  const revision = await findRevision(dataSource, projectId, revisionId);
  if (!revision) throw new NotFoundError('Model revision not found.', { code: 'revision_not_found' });
  if (revision.status === 'failed') {
    const why = revision.error ? `: ${revision.error}` : '.';
    throw new ConflictError(`The model of ${revisionLabel(revision)} could not be read${why} Upload a corrected model and use that revision.`, {
      code: 'revision_not_ready',
      details: { status: revision.status },
    });
  }
  if (revision.status !== 'ready') {
    throw new ConflictError(`The model of ${revisionLabel(revision)} is still being read. Try again when it is ready.`, {
      code: 'revision_not_ready',
      details: { status: revision.status },
    });
  }
  return revision;
}

/** The members of a ready revision in file order (call readyRevision first); callers must not change the records. */
export function revisionMembers(dataSource: DataSource, revisionId: string): Promise<readonly MemberRecord[]> {
  let cache = memberCaches.get(dataSource);
  if (!cache) memberCaches.set(dataSource, (cache = new LruPromiseCache(KEPT_REVISIONS)));
  return cache.get(revisionId, () => loadMemberRecords(dataSource, revisionId));
}
