import { ConflictError, NotFoundError } from '../http/errors';
import type { ModelRevision } from './model-revision.entity';

export function revisionNotFound(): NotFoundError {
  return new NotFoundError('Model revision not found.', { code: 'revision_not_found' });
}

/** Members and geometry are asked for before the revision's ingest finished, or after it failed. */
export function revisionNotReady(revision: Pick<ModelRevision, 'number' | 'status'>): ConflictError {
  const state = revision.status === 'failed' ? 'could not be read' : 'is still being read';
  return new ConflictError(`Revision ${revision.number} ${state}; its members and geometry are not available.`, { code: 'revision_not_ready' });
}
