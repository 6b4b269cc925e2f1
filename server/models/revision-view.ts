import type { IfcSchema } from '../ifc/model-read-result';
import type { ModelRevision, RevisionCounts, RevisionStatus } from './model-revision.entity';

/** A revision as the API shows it. */
export interface RevisionView {
  id: string;
  number: number;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  note: string;
  /** Null when the uploader's account was deleted. */
  uploadedBy: { id: string; name: string } | null;
  uploadedAt: string;
  status: RevisionStatus;
  /** While queued or ingesting: the current phase and the fraction of the whole ingest (0 to 1). */
  progress: { phase: string; fraction: number } | null;
  error: string | null;
  schema: IfcSchema | null;
  lengthUnit: string | null;
  counts: RevisionCounts | null;
}

/** `revision.uploadedBy` must be loaded (relations: { uploadedBy: true }). */
export function toRevisionView(revision: ModelRevision): RevisionView {
  const uploader = revision.uploadedBy;
  return {
    id: revision.id,
    number: revision.number,
    fileName: revision.fileName,
    sizeBytes: revision.sizeBytes,
    sha256: revision.sha256,
    note: revision.note,
    uploadedBy: uploader ? { id: uploader.id, name: uploader.name } : null,
    uploadedAt: revision.uploadedAt.toISOString(),
    status: revision.status,
    progress:
      revision.progressPhase !== null && revision.progressFraction !== null
        ? { phase: revision.progressPhase, fraction: revision.progressFraction }
        : null,
    error: revision.error,
    schema: revision.schema,
    lengthUnit: revision.lengthUnit,
    counts: revision.counts,
  };
}
