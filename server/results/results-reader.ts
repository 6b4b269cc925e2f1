/**
 * Streams a results file through a column mapping into typed rows, handed to a sink in batches (a database writer
 * inserts them inside one transaction, an aggregator keeps only governing values). Rows are never all in memory.
 *
 * Several sheets of a workbook are read one after the other through the same mapping (`mapping.sheets`).
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
  /** Data records imported (a wide-layout record holds several combinations). */
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
  const sheets = sheetsToRead(mapping, options.sheet);
  const keys = new ResultKeyIndex(mapping.stationColumn !== undefined, sheets.length > 1 ? (sheets as string[]) : undefined);
  const issues: RowIssue[] = [];
  const rows: ResultRow[] = [];
  let batch: ResultRow[] = [];
  let rowCount = 0;
  let blankRows = 0;
  let lastRow = 0;
  let first: Omit<ResultsTable, 'records'> | undefined;

  reading: for (let sheetIndex = 0; sheetIndex < sheets.length; sheetIndex++) {
    const { records, ...table } = await openResultsTable(path, { ...options, sheet: sheets[sheetIndex], chunkSize: Math.min(batchSize, 1000) });
    try {
      if (mapping.combinationFromSheet && table.kind !== 'xlsx') {
        throw new ResultsFileError('invalid_mapping', 'The mapping takes the combination from the sheet name, but the file is CSV, which has no sheets. Map a combination column.');
      }
      first ??= table;
      const columns = resolveColumns(mapping, table.headers);
      const readRow = createRowReader(mapping, columns, { headers: table.headers, decimalSeparator: table.decimalSeparator, sheet: table.sheet, sheetInMessages: sheets.length > 1, ...(sheets.length > 1 && { sheetIndex }) });
      keys.sheet = sheetIndex;
      lastRow = table.unitsRow ?? table.headerRow ?? 0;
      for await (const chunk of records) {
        for (const record of chunk) {
          lastRow = record.row;
          if (isBlankRecord(record.cells)) {
            blankRows++;
            continue;
          }
          rows.length = 0;
          const problems = readRow(record, rows);
          if (problems) {
            issues.push(...problems);
            if (issues.length >= maxIssues) break reading;
            continue;
          }
          let registered = true;
          for (const row of rows) {
            const problem = keys.register(row);
            if (problem) {
              issues.push(problem);
              if (issues.length >= maxIssues) break reading;
              registered = false;
            } else if (issues.length === 0) {
              batch.push(row);
            }
          }
          if (registered) rowCount++;
          if (batch.length >= batchSize && issues.length === 0) {
            await sink(batch);
            batch = [];
          }
        }
      }
    } finally {
      // Releases the file when reading stopped early or the mapping did not fit the header.
      await records.return(undefined);
    }
  }

  if (issues.length > 0) throw rowsInvalid(issues.slice(0, maxIssues), issues.length >= maxIssues, lastRow);
  if (rowCount === 0) throw new ResultsFileError('no_rows', 'The file has a header but no result rows.');
  if (batch.length > 0) await sink(batch);
  return { ...first!, ...(sheets.length > 1 && { sheet: sheets.join(', ') }), rowCount, blankRows, memberKeys: keys.memberKeys(), combinations: keys.combinations() };
}

/** The sheets the mapping names, else the one asked for (undefined: a CSV file, or a workbook's only sheet). */
function sheetsToRead(mapping: ColumnMapping, sheet: string | undefined): Array<string | undefined> {
  if (!mapping.sheets) return [sheet];
  if (sheet !== undefined && !mapping.sheets.includes(sheet)) {
    throw new ResultsFileError('invalid_mapping', `The mapping reads the sheets ${mapping.sheets.join(', ')}; the sheet chosen, '${sheet}', is not among them.`);
  }
  return mapping.sheets;
}

function rowsInvalid(issues: RowIssue[], stoppedEarly: boolean, lastRow: number): ResultsFileError {
  const count = stoppedEarly ? `Reading stopped at row ${lastRow} after ${issues.length} problems` : `${issues.length} problem${issues.length === 1 ? '' : 's'} found`;
  return new ResultsFileError(
    'rows_invalid',
    `The results cannot be imported: ${count}. The first: ${issues[0].message} Fix the file (or the column mapping) and upload it again.`,
    { issues, stoppedEarly, lastRow },
  );
}
