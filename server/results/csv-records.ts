import fs from 'node:fs';
import { parse, type Options } from 'csv-parse';
import type { RawRecord } from './cell-values';
import type { CsvFormat } from './csv-format';
import { ResultsFileError } from './results-file-error';

/**
 * csv-parse options for a sniffed format. Blank lines are kept (as one empty cell) so that record numbers stay the
 * row numbers a spreadsheet shows; ragged rows are allowed so a short row gets a row error, not a file error.
 */
export function csvParseOptions(format: CsvFormat): Options {
  return { delimiter: format.delimiter, bom: true, relax_column_count: true, relax_quotes: true };
}

/**
 * Streams the records of a CSV file in chunks; only one chunk is held at a time. Records are taken off the parser with
 * read() as they become readable (one await per buffer fill, not one per record as for-await over the stream would).
 */
export async function* csvRecordChunks(path: string, format: CsvFormat, chunkSize: number): AsyncGenerator<RawRecord[]> {
  // UTF-16 text is decoded by the file stream; csv-parse re-encodes strings as UTF-8 and drops the BOM itself.
  const input = fs.createReadStream(path, format.encoding === 'utf16le' ? { encoding: 'utf16le' } : {});
  const parser = input.pipe(parse(csvParseOptions(format)));
  const state: { failure?: unknown; ended: boolean; wake?: () => void } = { ended: false };
  const wake = () => state.wake?.();
  input.on('error', (error) => parser.destroy(error));
  parser.on('readable', wake);
  parser.on('end', () => {
    state.ended = true;
    wake();
  });
  parser.on('error', (error) => {
    state.failure = error;
    wake();
  });
  let row = 0;
  try {
    for (;;) {
      const chunk: RawRecord[] = [];
      let cells: string[] | null;
      while (chunk.length < chunkSize && (cells = parser.read() as string[] | null) !== null) chunk.push({ row: ++row, cells });
      if (state.failure !== undefined) throw state.failure;
      if (chunk.length > 0) yield chunk;
      else if (state.ended) return;
      else await new Promise<void>((resolve) => (state.wake = resolve));
    }
  } catch (error) {
    throw unreadableCsv(error, row + 1);
  } finally {
    input.destroy();
    parser.destroy();
  }
}

function unreadableCsv(error: unknown, row: number): ResultsFileError {
  const lines = (error as { lines?: unknown }).lines;
  const where = typeof lines === 'number' ? `near line ${lines}` : `near row ${row}`;
  const what =
    (error as { code?: unknown }).code === 'CSV_QUOTE_NOT_CLOSED'
      ? 'a quoted value is never closed'
      : `it is not valid CSV (${error instanceof Error ? error.message : String(error)})`;
  return new ResultsFileError('unreadable_csv', `The CSV file cannot be read ${where}: ${what}. Check the quoting there and upload it again.`, {
    lastRow: row,
  });
}
