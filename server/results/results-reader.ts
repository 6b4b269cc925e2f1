/**
 * Streams a results file through a column mapping into typed rows, handed to a sink in batches (a database writer
 * inserts them inside one transaction, an aggregator keeps only governing values). Rows are never all in memory.
 *
 * All or nothing: once a row is bad no further batch reaches the sink, reading goes on to collect up to `maxIssues`
 * problems, and the call throws `rows_invalid` with them, so the caller rolls back whatever it wrote.
 */
import { type ColumnMapping, resolveColumns } from './column-mapping';
import { isBlankRecord, openResultsTable, type ResultsTable, type ResultsTableOptions } from './results-table';
import { ResultsFileError, type RowIssue } from './results-file-error';
import { type ResultKeySummary, ResultKeyIndex } from './result-key-index';
import { createRowReader, type ResultRow } from './result-row';

export type ResultsSink = (batch: ResultRow[]) => void | Promise<void>;

export interface ReadResultsOptions extends ResultsTableOptions {
  /** Rows per sink call. */
  batchSize?: number;
  /** Problems collected before reading stops. */
  maxIssues?: number;
}

export interface ResultsReadSummary extends Omit<ResultsTable, 'records'> {
  /** Data rows imported. */
  rowCount: number;
  /** Empty rows passed over. */
  blankRows: number;
  /** Distinct member keys in order of first appearance, with their end points when mapped. */
  memberKeys: ResultKeySummary[];
  combinations: string[];
}

export const DEFAULT_BATCH_SIZE = 5000;
export const DEFAULT_MAX_ISSUES = 100;

export async function readResults(
  path: string,
  mapping: ColumnMapping,
  sink: ResultsSink,
  options: ReadResultsOptions = {},
): Promise<ResultsReadSummary> {
  const batchSize = options.batchSize ?? DEFAULT_BATCH_SIZE;
  const maxIssues = options.maxIssues ?? DEFAULT_MAX_ISSUES;
  const { records, ...table } = await openResultsTable(path, { ...options, chunkSize: Math.min(batchSize, 1000) });
  try {
    const columns = resolveColumns(mapping, table.headers);
    const readRow = createRowReader(mapping, columns, table.headers, table.decimalSeparator);
    const keys = new ResultKeyIndex(columns.station !== undefined);
    const issues: RowIssue[] = [];
    let batch: ResultRow[] = [];
    let rowCount = 0;
    let blankRows = 0;
    let lastRow = table.headerRow ?? 0;

    reading: for await (const chunk of records) {
      for (const record of chunk) {
        lastRow = record.row;
        if (isBlankRecord(record.cells)) {
          blankRows++;
          continue;
        }
        const read = readRow(record);
        const problem = Array.isArray(read) ? read : keys.register(read);
        if (problem !== undefined) {
          if (Array.isArray(problem)) issues.push(...problem);
          else issues.push(problem);
          if (issues.length >= maxIssues) break reading;
          continue;
        }
        rowCount++;
        if (issues.length > 0) continue;
        batch.push(read as ResultRow);
        if (batch.length >= batchSize) {
          await sink(batch);
          batch = [];
        }
      }
    }

    if (issues.length > 0) throw rowsInvalid(issues.slice(0, maxIssues), issues.length >= maxIssues, lastRow);
    if (rowCount === 0) throw new ResultsFileError('no_rows', 'The file has a header but no result rows.');
    if (batch.length > 0) await sink(batch);
    return { ...table, rowCount, blankRows, memberKeys: keys.memberKeys(), combinations: keys.combinations() };
  } finally {
    // Releases the file when reading stopped early or the mapping did not fit the header.
    await records.return(undefined);
  }
}

function rowsInvalid(issues: RowIssue[], stoppedEarly: boolean, lastRow: number): ResultsFileError {
  const count = stoppedEarly ? `Reading stopped at row ${lastRow} after ${issues.length} problems` : `${issues.length} problem${issues.length === 1 ? '' : 's'} found`;
  return new ResultsFileError(
    'rows_invalid',
    `The results cannot be imported: ${count}. The first: ${issues[0].message} Fix the file (or the column mapping) and upload it again.`,
    { issues, stoppedEarly, lastRow },
  );
}
