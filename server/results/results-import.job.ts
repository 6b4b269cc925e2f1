/**
 * Worker: reads a results file through its mapping and writes the governing-shear file, so parsing a million rows
 * never holds up the server's event loop. A bad file comes back as a ValidationError (code and details intact).
 */
import { writeFile } from 'node:fs/promises';
import { defineJob } from '../jobs/job-worker';
import type { ColumnMapping } from './column-mapping';
import { encodeGoverningTable } from './governing-file';
import { ResultsFileError, asDomainError } from './results-file-error';
import { importResultsFile } from './results-import';
import type { ResultsReadSummary } from './results-reader';

export interface ResultsImportJobInput {
  file: string;
  mapping: ColumnMapping;
  sheet?: string;
  /** Where to write the governing-shear file. */
  governingFile: string;
}

export type ResultsImportJobOutput = Pick<ResultsReadSummary, 'kind' | 'sheet' | 'rowCount' | 'memberKeys' | 'combinations'>;

export default defineJob(async (input: ResultsImportJobInput): Promise<ResultsImportJobOutput> => {
  try {
    const { summary, governing } = await importResultsFile(input.file, input.mapping, input.sheet);
    await writeFile(input.governingFile, encodeGoverningTable(governing));
    return { kind: summary.kind, sheet: summary.sheet, rowCount: summary.rowCount, memberKeys: summary.memberKeys, combinations: summary.combinations };
  } catch (error) {
    throw error instanceof ResultsFileError ? asDomainError(error) : error;
  }
});
