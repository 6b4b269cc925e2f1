import { randomUUID } from 'node:crypto';
import { createReadStream, mkdirSync } from 'node:fs';
import { rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';
import type { Logger } from 'pino';
import { type DataSource, type EntityManager, In, Not } from 'typeorm';
import { runTransaction } from '../data-source';
import { type GradeId, gradeFromMaterialName, isGradeId } from '../engine/grades';
import { ConflictError, DomainError } from '../http/errors';
import type { JobRunner } from '../jobs/job-runner';
import { workerFile } from '../jobs/job-runner';
import { Project } from '../projects/project.entity';
import type { FileStorage } from '../storage/file-storage';
import { overallFraction, phaseActivity } from './ingest-phases';
import type { IngestJobInput, IngestJobOutput } from './model-ingest.job';
import { storeMembers } from './member-store';
import { ModelMember } from './model-member.entity';
import { ModelMemberRecord } from './model-member-record.entity';
import { toRevisionView } from './model-queries';
import { ModelRevision } from './model-revision.entity';
import type { CheckedIfc } from './model-upload';
import { ProjectCatalogueService } from './project-catalogue.service';
import { revisionNotFound, revisionNotReady } from './revision-errors';
import { ProgressRecorder, RevisionEvents } from './revision-progress';
import type { RevisionView } from './revision-view';

export interface ModelServiceDeps {
  dataSource: DataSource;
  storage: FileStorage;
  jobs: JobRunner;
  logger: Logger;
  /** Where ingests keep their working copy of the IFC file and the .glb being baked. */
  workDir: string;
}

/**
 * A new revision and its ingest, which never rejects: a failure marks the revision failed. It resolves to the revision
 * as the ingest left it, or null if the revision was deleted meanwhile (with its project).
 */
export interface AcceptedRevision {
  revision: RevisionView;
  ingested: Promise<RevisionView | null>;
}

const INGEST_WORKER = workerFile(__filename, './model-ingest.job');
const WITH_UPLOADER = { uploadedBy: true } as const;

function fileKeys(projectId: string, revisionId: string) {
  const base = `projects/${projectId}/models/${revisionId}`;
  return { ifc: `${base}.ifc`, glb: `${base}.glb` };
}

function defaultGradeOf(project: Project | null): GradeId | undefined {
  const grade = project?.settings.defaultGrade;
  if (!grade) return undefined;
  return isGradeId(grade) ? grade : (gradeFromMaterialName(grade) ?? undefined);
}

/** Model revisions of a project: upload, ingest in a worker, progress, and the stored files. */
export class ModelService {
  readonly events = new RevisionEvents();
  private readonly catalogue: ProjectCatalogueService;

  constructor(private readonly deps: ModelServiceDeps) {
    this.catalogue = new ProjectCatalogueService(deps.dataSource);
  }

  async list(projectId: string): Promise<RevisionView[]> {
    const revisions = await this.revisions().find({ where: { projectId }, order: { number: 'DESC' }, relations: WITH_UPLOADER });
    return revisions.map(toRevisionView);
  }

  async get(projectId: string, revisionId: string): Promise<RevisionView> {
    return toRevisionView(await this.find(projectId, revisionId));
  }

  /**
   * Stores a checked IFC file as the project's next revision and starts its ingest. The same content already in the
   * project (unless that revision failed) is refused. `ownFile` moves the file into the ingest's working folder
   * (an upload); otherwise it is only read (a demo asset).
   */
  async accept(projectId: string, userId: string, ifc: CheckedIfc, note: string, ownFile: boolean): Promise<AcceptedRevision> {
    await this.assertNotDuplicate(this.deps.dataSource.manager, projectId, ifc.sha256);
    const id = randomUUID();
    const keys = fileKeys(projectId, id);
    const ifcPath = ownFile ? await this.takeOver(ifc.path, id) : ifc.path;
    let saved: ModelRevision;
    try {
      await this.deps.storage.put(keys.ifc, createReadStream(ifcPath));
      saved = await runTransaction(this.deps.dataSource, async (manager) => {
        await this.assertNotDuplicate(manager, projectId, ifc.sha256);
        const last = await manager.findOne(ModelRevision, { where: { projectId }, order: { number: 'DESC' }, select: { id: true, number: true } });
        return manager.save(
          manager.create(ModelRevision, {
            id,
            projectId,
            number: (last?.number ?? 0) + 1,
            fileName: ifc.fileName.slice(0, 255),
            sizeBytes: ifc.sizeBytes,
            sha256: ifc.sha256,
            note,
            uploadedById: userId,
            status: 'queued',
            schema: ifc.header.schema,
            fileSchema: ifc.header.fileSchema,
            application: ifc.header.application?.slice(0, 255) ?? null,
            fileKey: keys.ifc,
          }),
        );
      });
    } catch (error) {
      await this.deps.storage.delete(keys.ifc);
      if (ownFile) await rm(ifcPath, { force: true });
      throw error;
    }
    const ingested = this.ingest(saved, ifcPath, ownFile);
    return { revision: await this.get(projectId, id), ingested };
  }

  /** The stored .glb of a ready revision. */
  async geometry(projectId: string, revisionId: string): Promise<{ stream: Readable; sizeBytes: number }> {
    const revision = await this.find(projectId, revisionId);
    if (revision.status !== 'ready' || !revision.glbKey) throw revisionNotReady(revision);
    const sizeBytes = (await this.deps.storage.size(revision.glbKey)) ?? 0;
    return { stream: await this.deps.storage.stream(revision.glbKey), sizeBytes };
  }

  /**
   * Marks revisions left queued or ingesting by a stopped server as failed, removing their members and files. Run
   * once at start, before any upload can begin.
   */
  async failInterrupted(): Promise<void> {
    const stuck = await this.revisions().find({ where: { status: In(['queued', 'ingesting']) } });
    for (const revision of stuck) {
      await this.fail(revision, 'The server stopped before this model was read completely. Upload the file again to read it.');
    }
  }

  private async ingest(revision: ModelRevision, ifcPath: string, ownFile: boolean): Promise<RevisionView | null> {
    const { dataSource, storage, jobs, logger, workDir } = this.deps;
    const keys = fileKeys(revision.projectId, revision.id);
    const glbPath = path.join(workDir, `${revision.id}.glb`);
    const membersPath = path.join(workDir, `${revision.id}.members`);
    const progress = new ProgressRecorder(dataSource, revision.id, this.events);
    try {
      mkdirSync(workDir, { recursive: true });
      const project = await dataSource.getRepository(Project).findOneBy({ id: revision.projectId });
      const input: IngestJobInput = {
        ifcPath,
        glbPath,
        membersPath,
        fileName: revision.fileName,
        defaultGrade: defaultGradeOf(project),
        projectCatalogue: await this.catalogue.sectionsOf(revision.projectId),
      };
      const { model } = await jobs.run<IngestJobInput, IngestJobOutput>(INGEST_WORKER, input, { onProgress: (p) => progress.report(p) });
      await storeMembers(dataSource, revision.id, membersPath, model.counts.members, (f) => progress.report({ fraction: overallFraction('store', f), message: 'store' }));
      await progress.flush();
      await storage.put(keys.glb, createReadStream(glbPath));
      const { counts } = model;
      await this.revisions().update(
        { id: revision.id },
        {
          status: 'ready',
          progressPhase: null,
          progressFraction: null,
          schema: model.schema,
          fileSchema: model.fileSchema,
          lengthUnit: model.lengthUnit,
          application: model.application?.slice(0, 255) ?? revision.application,
          counts: { members: counts.members, ok: counts.ok, notApplicable: counts.notApplicable, flagged: counts.flagged, context: counts.contextElements },
          glbKey: keys.glb,
          finishedAt: new Date(),
        },
      );
      this.events.publish(revision.id, { status: 'ready', phase: null, fraction: null, error: null });
    } catch (error) {
      await progress.flush();
      if (!(error instanceof DomainError)) logger.error({ err: error, revisionId: revision.id }, 'model ingest failed');
      await this.fail(revision, failureMessage(error, phaseActivity(progress.phase))).catch((failure: unknown) =>
        logger.error({ err: failure, revisionId: revision.id }, 'could not mark the revision failed'),
      );
    } finally {
      await rm(glbPath, { force: true });
      await rm(membersPath, { force: true });
      if (ownFile) await rm(ifcPath, { force: true });
    }
    return this.get(revision.projectId, revision.id).catch(() => null);
  }

  /** Failed revisions keep their record and message, but no members and no files. */
  private async fail(revision: ModelRevision, message: string): Promise<void> {
    await runTransaction(this.deps.dataSource, async (manager) => {
      await manager.delete(ModelMember, { revisionId: revision.id });
      await manager.delete(ModelMemberRecord, { revisionId: revision.id });
      await manager.update(
        ModelRevision,
        { id: revision.id },
        { status: 'failed', error: message.slice(0, 2000), progressPhase: null, progressFraction: null, fileKey: null, glbKey: null, finishedAt: new Date() },
      );
    });
    const keys = fileKeys(revision.projectId, revision.id);
    await this.deps.storage.delete(keys.ifc);
    await this.deps.storage.delete(keys.glb);
    this.events.publish(revision.id, { status: 'failed', phase: null, fraction: null, error: message });
  }

  private async assertNotDuplicate(manager: EntityManager, projectId: string, sha256: string): Promise<void> {
    const existing = await manager.findOne(ModelRevision, { where: { projectId, sha256, status: Not('failed') }, select: { id: true, number: true } });
    if (existing) {
      throw new ConflictError(`This file was already uploaded as revision ${existing.number}; it is not stored twice.`, {
        code: 'duplicate_file',
        details: { revisionId: existing.id },
      });
    }
  }

  private async find(projectId: string, revisionId: string): Promise<ModelRevision> {
    const revision = await this.revisions().findOne({ where: { id: revisionId, projectId }, relations: WITH_UPLOADER });
    if (!revision) throw revisionNotFound();
    return revision;
  }

  /** Moves an uploaded file into the working folder, out of reach of the request's clean-up. */
  private async takeOver(file: string, revisionId: string): Promise<string> {
    mkdirSync(this.deps.workDir, { recursive: true });
    const target = path.join(this.deps.workDir, `${revisionId}.ifc`);
    await rename(file, target);
    return target;
  }

  private revisions() {
    return this.deps.dataSource.getRepository(ModelRevision);
  }
}

/** What went wrong and where, for the person who uploaded the file; internal details stay in the log. */
export function failureMessage(error: unknown, activity: string): string {
  if (error instanceof DomainError) return `The model could not be read (while ${activity}): ${error.message}`;
  return (
    `The model reader stopped unexpectedly while ${activity}. The file may be damaged or too large for this server; ` +
    'export it again from the authoring tool and upload it, or ask your administrator to check the server log.'
  );
}
