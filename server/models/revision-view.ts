/** Model revisions as the API shows them; plain types, shared with the client. */
import type { IfcSchema } from '../ifc/model-read-result';

export const REVISION_STATUSES = ['queued', 'ingesting', 'ready', 'failed'] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];

/** Member counts of an ingested revision (context = slabs, walls… shown only for orientation). */
export interface RevisionCounts {
  members: number;
  ok: number;
  notApplicable: number;
  flagged: number;
  context: number;
}

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
