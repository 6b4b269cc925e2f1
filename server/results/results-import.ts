/**
 * Reading a whole results file for import: every row validated, only the governing shear per member key and
 * combination kept. Shared by the import worker and the command line.
 */
import type { ColumnMapping } from './column-mapping';
import { type GoverningTable, GoverningShearCollector } from './governing-shear';
import { type ResultsReadSummary, readResults } from './results-reader';

export interface ImportedResults {
  summary: ResultsReadSummary;
  governing: GoverningTable;
}

/** Throws ResultsFileError for a file or mapping that cannot be imported (nothing partial is returned). */
export async function importResultsFile(file: string, mapping: ColumnMapping, sheet?: string): Promise<ImportedResults> {
  const collector = new GoverningShearCollector();
  const summary = await readResults(file, mapping, collector.add, { sheet });
  return { summary, governing: collector.table(mapping.sheets) };
}
