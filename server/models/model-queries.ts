/**
 * Read access to model revisions for other features (results matching, check runs, findings, demo steps). Returns
 * plain records, never entities.
 */
import { type DataSource, LessThan } from 'typeorm';
import type { MemberRecord } from '../ifc/model-read-result';
import { ModelMemberRecord } from './model-member-record.entity';
import { ModelRevision } from './model-revision.entity';
import type { RevisionView } from './revision-view';

export type { RevisionView } from './revision-view';

const WITH_UPLOADER = { uploadedBy: true } as const;

/** The revision of that project, whatever its status, or null. */
export async function findRevision(dataSource: DataSource, projectId: string, revisionId: string): Promise<RevisionView | null> {
  const revision = await dataSource.getRepository(ModelRevision).findOne({ where: { id: revisionId, projectId }, relations: WITH_UPLOADER });
  return revision ? toRevisionView(revision) : null;
}

/** Every member of a revision in file order (empty unless the revision is ready). */
export async function loadMemberRecords(dataSource: DataSource, revisionId: string): Promise<MemberRecord[]> {
  const rows = await dataSource
    .getRepository(ModelMemberRecord)
    .createQueryBuilder('m')
    .select('m.record', 'record')
    .innerJoin(ModelRevision, 'r', 'r.id = m.revisionId AND r.status = :ready', { ready: 'ready' })
    .where('m.revisionId = :revisionId', { revisionId })
    .orderBy('m.expressId', 'ASC')
    .getRawMany<{ record: string }>();
  return rows.map((row) => JSON.parse(row.record) as MemberRecord);
}

/** The newest ready revision uploaded before this one, or null. */
export async function previousRevision(dataSource: DataSource, projectId: string, revisionId: string): Promise<RevisionView | null> {
  const revisions = dataSource.getRepository(ModelRevision);
  const current = await revisions.findOne({ where: { id: revisionId, projectId }, select: { id: true, number: true } });
  if (!current) return null;
  const previous = await revisions.findOne({
    where: { projectId, status: 'ready', number: LessThan(current.number) },
    order: { number: 'DESC' },
    relations: WITH_UPLOADER,
  });
  return previous ? toRevisionView(previous) : null;
}

/** The project's newest ready revision, or null. */
export async function latestReadyRevision(dataSource: DataSource, projectId: string): Promise<RevisionView | null> {
  const latest = await dataSource
    .getRepository(ModelRevision)
    .findOne({ where: { projectId, status: 'ready' }, order: { number: 'DESC' }, relations: WITH_UPLOADER });
  return latest ? toRevisionView(latest) : null;
}

/** The API view of a revision entity; `revision.uploadedBy` must be loaded (relations: { uploadedBy: true }). */
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
