/**
 * Importing a results file as a result set, all or nothing: the file is read in a worker (every row validated, the
 * governing shears written to a compact file), the keys are matched to the revision's members, and the result set, its
 * keys and an optional mapping template go to the database in one transaction. Any failure leaves no trace.
 */
import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import type { DataSource } from 'typeorm';
import { runTransaction } from '../data-source';
import { NotFoundError } from '../http/errors';
import { workerFile } from '../jobs/job-runner';
import type { JobRunner } from '../jobs/job-runner';
import type { FileStorage } from '../storage/file-storage';
import type { ColumnMapping } from './column-mapping';
import { insertRows } from './bulk-insert';
import { withLocalCopy, withScratchFile } from './local-copy';
import { MappingTemplateService } from './mapping-template.service';
import type { GeometryMatchOptions, MatchableKey } from './member-matching';
import { readyRevision } from './ready-revision';
import { ResultKey } from './result-key.entity';
import { ResultMatchingService } from './result-matching.service';
import { ResultSet } from './result-set.entity';
import { toResultSetView } from './result-views';
import type { ResultSetView } from './results-api-types';
import type { ResultsImportJobInput, ResultsImportJobOutput } from './results-import.job';
import { ResultsUploadService } from './results-upload.service';

const IMPORT_WORKER = workerFile(__filename, './results-import.job');
const KEY_COLUMNS = ['resultSetId', 'keyIndex', 'memberKey', 'rowCount', 'firstRow', 'ends'] as const satisfies readonly (keyof ResultKey)[];
/** How far an analysis end point may lie from the model's member axis when the request does not say (our choice). */
export const DEFAULT_GEOMETRY_TOLERANCE_MM = 250;

export interface ResultSetDeps {
  dataSource: DataSource;
  storage: FileStorage;
  jobs: JobRunner;
  workDir: string;
  matching: ResultMatchingService;
}

export interface ImportRequest {
  uploadId: string;
  sheet?: string;
  mapping: ColumnMapping;
  modelRevisionId: string;
  name: string;
  saveTemplateAs?: string;
  geometry?: Partial<GeometryMatchOptions>;
}

const WITH_CREATOR = { createdBy: true } as const;

export class ResultSetService {
  private readonly uploads: ResultsUploadService;
  private readonly templates: MappingTemplateService;

  constructor(private readonly deps: ResultSetDeps) {
    this.uploads = new ResultsUploadService(deps);
    this.templates = new MappingTemplateService(deps.dataSource);
  }

  async list(projectId: string): Promise<ResultSetView[]> {
    const sets = await this.deps.dataSource.getRepository(ResultSet).find({ where: { projectId }, order: { createdAt: 'DESC' }, relations: WITH_CREATOR });
    return sets.map(toResultSetView);
  }

  async get(projectId: string, resultSetId: string): Promise<ResultSetView> {
    const resultSet = await this.deps.dataSource.getRepository(ResultSet).findOne({ where: { id: resultSetId, projectId }, relations: WITH_CREATOR });
    if (!resultSet) throw new NotFoundError('Result set not found.', { code: 'result_set_not_found' });
    return toResultSetView(resultSet);
  }

  async importResults(projectId: string, actorId: string, request: ImportRequest): Promise<ResultSetView> {
    const { storage, dataSource } = this.deps;
    const upload = await this.uploads.find(projectId, request.uploadId);
    const revision = await readyRevision(dataSource, projectId, request.modelRevisionId);
    if (request.saveTemplateAs) await this.templates.assertNameFree(projectId, request.saveTemplateAs);
    const geometry = geometryOptions(request);

    const id = randomUUID();
    const governingKey = `projects/${projectId}/results/${id}/governing.bin`;
    const imported = await withLocalCopy(storage, upload.fileKey, this.deps.workDir, (file) =>
      withScratchFile(this.deps.workDir, async (governingFile) => {
        const input: ResultsImportJobInput = { file, mapping: request.mapping, sheet: request.sheet, governingFile };
        const output = await this.deps.jobs.run<ResultsImportJobInput, ResultsImportJobOutput>(IMPORT_WORKER, input);
        await storage.put(governingKey, createReadStream(governingFile));
        return output;
      }),
    );
    try {
      const keys: MatchableKey[] = imported.memberKeys.map((key) => ({ memberKey: key.memberKey, end1_mm: key.end1_mm, end2_mm: key.end2_mm }));
      const { summary } = await this.deps.matching.matchKeys(projectId, keys, { keyKind: request.mapping.memberKeyKind, geometry }, revision);
      await runTransaction(dataSource, async (manager) => {
        await manager.insert(ResultSet, {
          id,
          projectId,
          modelRevisionId: revision.id,
          name: request.name,
          fileName: upload.fileName,
          format: upload.format,
          sheet: imported.sheet ?? null,
          sha256: upload.sha256,
          fileKey: upload.fileKey,
          governingKey,
          mapping: request.mapping,
          geometry,
          rowCount: imported.rowCount,
          memberKeyCount: imported.memberKeys.length,
          combinations: imported.combinations,
          forceUnit: request.mapping.forceUnit,
          matching: summary,
          createdById: actorId,
        });
        const keys = imported.memberKeys.map((key, keyIndex) => [
          id,
          keyIndex,
          key.memberKey,
          key.rows,
          key.firstRow,
          key.end1_mm && key.end2_mm ? JSON.stringify([key.end1_mm, key.end2_mm]) : null,
        ]);
        await insertRows(manager, manager.connection.getMetadata(ResultKey).tableName, KEY_COLUMNS, keys);
        if (request.saveTemplateAs) await this.templates.create(projectId, request.saveTemplateAs, request.mapping, actorId, manager);
      });
    } catch (error) {
      await storage.delete(governingKey);
      throw error;
    }
    return this.get(projectId, id);
  }
}

/** Geometry matching is on when the mapping names end-point columns. */
function geometryOptions(request: ImportRequest): GeometryMatchOptions | null {
  if (!request.mapping.endColumns) return null;
  const given = request.geometry ?? {};
  return {
    tolerance_mm: given.tolerance_mm ?? DEFAULT_GEOMETRY_TOLERANCE_MM,
    ...(given.scale !== undefined && { scale: given.scale }),
    ...(given.offset_mm !== undefined && { offset_mm: given.offset_mm }),
  };
}
