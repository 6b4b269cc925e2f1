/**
 * What the mapping form shows before an import: the sniffed format, the header, the first rows as text and a guessed
 * mapping. Reads only the head of the file, whatever its size.
 */
import { cellText } from './cell-values';
import { type GuessContext, guessMapping, type MappingGuess } from './column-mapping';
import { isBlankRecord, openResultsTable, type ResultsTable, type ResultsTableOptions } from './results-table';

export interface PreviewRow {
  row: number;
  cells: string[];
}

export interface ResultsPreview extends Omit<ResultsTable, 'records'> {
  rows: PreviewRow[];
  guess: MappingGuess;
}

export const DEFAULT_PREVIEW_ROWS = 20;

export async function previewResultsFile(
  path: string,
  options: ResultsTableOptions & Pick<GuessContext, 'severalSheets'> & { rowLimit?: number } = {},
): Promise<ResultsPreview> {
  const rowLimit = options.rowLimit ?? DEFAULT_PREVIEW_ROWS;
  const { records, ...table } = await openResultsTable(path, { ...options, chunkSize: Math.max(rowLimit, 1) });
  const rows: PreviewRow[] = [];
  // Leaving the loop early closes the record stream (for-await calls its return()).
  reading: for await (const chunk of records) {
    for (const record of chunk) {
      if (isBlankRecord(record.cells)) continue;
      rows.push({ row: record.row, cells: record.cells.map(cellText) });
      if (rows.length >= rowLimit) break reading;
    }
  }
  return { ...table, rows, guess: guessMapping(table.headers, { units: table.units, severalSheets: options.severalSheets }) };
}
