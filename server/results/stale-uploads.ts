/**
 * Results uploads wait for their mapping; one that is never imported would keep its file for ever. Uploads older
 * than the configured age are removed, and their file with them unless a result set was imported from it (a result
 * set keeps the upload's file as its own).
 */
import type { Logger } from 'pino';
import { LessThan, type DataSource } from 'typeorm';
import type { FileStorage } from '../storage/file-storage';
import { ResultSet } from './result-set.entity';
import { ResultsUpload } from './results-upload.entity';

const HOUR_MS = 3_600_000;

export interface StaleUploadDeps {
  dataSource: DataSource;
  storage: FileStorage;
}

/** Removes the uploads created before `before`; returns how many went. */
export async function removeStaleUploads({ dataSource, storage }: StaleUploadDeps, before: Date): Promise<number> {
  const uploads = dataSource.getRepository(ResultsUpload);
  const stale = await uploads.find({ where: { createdAt: LessThan(before) }, select: { id: true, fileKey: true } });
  for (const upload of stale) {
    // The row goes first: an import that starts now finds no upload instead of a missing file.
    await uploads.delete({ id: upload.id });
    if (!(await dataSource.getRepository(ResultSet).existsBy({ fileKey: upload.fileKey }))) await storage.delete(upload.fileKey);
  }
  return stale.length;
}

/** Sweeps at start and then every hour until the returned stop function is called. */
export function sweepStaleUploads(deps: StaleUploadDeps & { logger: Logger }, keepHours: number): () => void {
  const sweep = () => {
    removeStaleUploads(deps, new Date(Date.now() - keepHours * HOUR_MS))
      .then((removed) => removed > 0 && deps.logger.info({ removed }, 'removed results uploads that were never imported'))
      .catch((error: unknown) => deps.logger.warn({ err: error }, 'could not remove old results uploads'));
  };
  sweep();
  const timer = setInterval(sweep, HOUR_MS);
  timer.unref();
  return () => clearInterval(timer);
}
