/**
 * Results files on their way in: an upload is checked by previewing it (format, header, first rows, a guessed
 * mapping), then kept in storage until it is imported. A file that cannot be read is refused and nothing is kept.
 */
import { randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { rm } from 'node:fs/promises';
import type { DataSource } from 'typeorm';
import { NotFoundError } from '../http/errors';
import type { ReceivedFile } from '../models/model-upload';
import type { FileStorage } from '../storage/file-storage';
import { withLocalCopy } from './local-copy';
import { ResultsFileError, asDomainError } from './results-file-error';
import { previewResultsFile } from './results-preview';
import type { ResultsUploadView } from './results-api-types';
import { ResultsUpload } from './results-upload.entity';

export interface ResultsUploadDeps {
  dataSource: DataSource;
  storage: FileStorage;
  /** Where stored uploads are copied to be read. */
  workDir: string;
}


type Preview = Omit<ResultsUploadView, 'id' | 'fileName' | 'sizeBytes' | 'sha256'>;

export class ResultsUploadService {
  constructor(private readonly deps: ResultsUploadDeps) {}

  /** `file` is the request's temporary file; it is removed whatever happens. */
  async upload(projectId: string, userId: string, file: Pick<ReceivedFile, 'path' | 'originalName'>): Promise<ResultsUploadView> {
    try {
      const preview = await previewOf(file.path);
      const id = randomUUID();
      const fileKey = `projects/${projectId}/results/uploads/${id}.${preview.format}`;
      const stored = await this.deps.storage.put(fileKey, createReadStream(file.path));
      try {
        await this.deps.dataSource.getRepository(ResultsUpload).insert({
          id,
          projectId,
          fileName: fileNameOf(file.originalName),
          format: preview.format,
          sizeBytes: stored.size_bytes,
          sha256: stored.sha256,
          fileKey,
          sheets: preview.sheets,
          createdById: userId,
        });
      } catch (error) {
        await this.deps.storage.delete(fileKey);
        throw error;
      }
      return { id, fileName: fileNameOf(file.originalName), sizeBytes: stored.size_bytes, sha256: stored.sha256, ...preview };
    } finally {
      await rm(file.path, { force: true });
    }
  }

  /** The preview of a stored upload, of the given sheet for a workbook. */
  async preview(projectId: string, uploadId: string, sheet?: string): Promise<ResultsUploadView> {
    const upload = await this.find(projectId, uploadId);
    const preview = await withLocalCopy(this.deps.storage, upload.fileKey, this.deps.workDir, (file) => previewOf(file, sheet));
    return { id: upload.id, fileName: upload.fileName, sizeBytes: upload.sizeBytes, sha256: upload.sha256, ...preview };
  }

  async find(projectId: string, uploadId: string): Promise<ResultsUpload> {
    const upload = await this.deps.dataSource.getRepository(ResultsUpload).findOneBy({ id: uploadId, projectId });
    if (!upload) throw new NotFoundError('Upload not found. Upload the results file again.', { code: 'upload_not_found' });
    return upload;
  }
}

/** A workbook of several sheets previews as its sheet list: the user chooses, then previews that sheet. */
async function previewOf(path: string, sheet?: string): Promise<Preview> {
  try {
    const preview = await previewResultsFile(path, { sheet });
    return {
      format: preview.kind,
      sheets: preview.sheets ?? null,
      sheet: preview.sheet ?? null,
      delimiter: preview.csv?.delimiter ?? null,
      decimalSeparator: preview.decimalSeparator,
      headerRow: preview.headerRow,
      headers: preview.headers,
      unitsRow: preview.unitsRow,
      units: preview.units,
      rows: preview.rows.map((row) => row.cells),
      guessedMapping: preview.guess.mapping,
      missingMapping: preview.guess.missing,
      unsureMapping: preview.guess.unsure,
    };
  } catch (error) {
    if (!(error instanceof ResultsFileError)) throw error;
    if (error.code === 'sheet_required' && sheet === undefined) {
      return { format: 'xlsx', sheets: error.details.sheets ?? [], sheet: null, delimiter: null, decimalSeparator: '.', headerRow: null, headers: [], unitsRow: null, units: [], rows: [], guessedMapping: {}, missingMapping: [], unsureMapping: [] };
    }
    throw asDomainError(error);
  }
}

/** The name as the user's computer called it, without any folder part a browser may send. */
function fileNameOf(originalName: string): string {
  const base = originalName.split(/[\\/]/).pop()?.trim() ?? '';
  return (base || 'results').slice(0, 255);
}
