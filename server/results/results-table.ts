/**
 * Opens a results file (CSV or XLSX, told apart by content, not by name) as a header plus a stream of data records,
 * the one shape both the preview and the reader work on.
 */
import fs from 'node:fs/promises';
import { type Cell, cellText, type DecimalSeparator, isBlankCell, looksNumeric, type RawRecord } from './cell-values';
import { csvRecordChunks } from './csv-records';
import { type CsvFormat, detectEncoding, firstRecordIsHeader, sniffCsvFormat } from './csv-format';
import type { ResultsFileKind } from './results-api-types';
import { ResultsFileError } from './results-file-error';
import { unitWord } from './unit-words';
import { listXlsxSheets, type XlsxSheet, xlsxRecordChunks } from './xlsx-workbook';

export interface ResultsTableOptions {
  /** XLSX: the sheet to read; required when the workbook has several. */
  sheet?: string;
  /** CSV: overrides of the sniffed format. */
  csv?: Partial<CsvFormat>;
  chunkSize?: number;
}

export interface ResultsTable {
  kind: ResultsFileKind;
  /** CSV only: the format used (sniffed, then overridden by the options). */
  csv?: CsvFormat;
  /** XLSX only: all worksheet names in tab order, and the one read. */
  sheets?: string[];
  sheet?: string;
  decimalSeparator: DecimalSeparator;
  /** Row of the header, or null when the file has none (columns are then called 'Column 1', 'Column 2', …). */
  headerRow: number | null;
  headers: string[];
  /** Row of a units row under the header ('m', 'kN', 'kNm'), or null; its cells per column ('' where none). */
  unitsRow: number | null;
  units: string[];
  /** The data records after the header (and the units row). Read to the end or call `return()` to release the file. */
  records: AsyncGenerator<RawRecord[]>;
}

const HEAD_BYTES = 64 * 1024;
const DEFAULT_CHUNK = 1000;
/** Records looked at to decide whether an XLSX sheet starts with a header. */
const HEADER_LOOKAHEAD = 50;

export function columnName(index: number): string {
  return `Column ${index + 1}`;
}

export async function openResultsTable(path: string, options: ResultsTableOptions = {}): Promise<ResultsTable> {
  const { head, complete } = await readHead(path);
  if (head.length === 0) throw emptyFile();
  const chunkSize = options.chunkSize ?? DEFAULT_CHUNK;
  if (isZip(head)) return openXlsx(path, options.sheet, chunkSize);
  if (isLegacyExcel(head)) {
    throw new ResultsFileError('unsupported_format', 'This is an old-style .xls workbook. Save it as .xlsx or CSV and upload it again.');
  }
  const encoding = options.csv?.encoding ?? detectEncoding(head);
  const sample = head.toString(encoding).replace(/^\uFEFF/, '');
  if (sample.trim() === '') throw emptyFile();
  const format: CsvFormat = { encoding, ...sniffCsvFormat(sample, complete), ...options.csv };
  const header = await splitHeader(csvRecordChunks(path, format, chunkSize), () => format.hasHeaderRow);
  return { kind: 'csv', csv: format, decimalSeparator: format.decimalSeparator, ...header };
}

async function openXlsx(path: string, wanted: string | undefined, chunkSize: number): Promise<ResultsTable> {
  const sheets = await listXlsxSheets(path);
  const names = sheets.map((sheet) => sheet.name);
  const sheet = chooseSheet(sheets, wanted);
  const header = await splitHeader(xlsxRecordChunks(path, sheet, chunkSize), (first) => firstRecordIsHeader(first.map((record) => record.cells.map(cellText))));
  // Text cells in a workbook carry no locale, and numeric cells are numbers already.
  return { kind: 'xlsx', sheets: names, sheet: sheet.name, decimalSeparator: '.', ...header };
}

function chooseSheet(sheets: XlsxSheet[], wanted: string | undefined): XlsxSheet {
  const names = sheets.map((sheet) => sheet.name);
  if (sheets.length === 0) throw new ResultsFileError('unreadable_xlsx', 'The XLSX workbook has no worksheets.');
  if (wanted === undefined) {
    if (sheets.length === 1) return sheets[0];
    throw new ResultsFileError('sheet_required', `The workbook has ${sheets.length} sheets (${names.join(', ')}). Choose the sheet that holds the shear results.`, {
      sheets: names,
    });
  }
  const exact = sheets.find((sheet) => sheet.name === wanted);
  const loose = sheets.filter((sheet) => sheet.name.trim().toLowerCase() === wanted.trim().toLowerCase());
  const found = exact ?? (loose.length === 1 ? loose[0] : undefined);
  if (found) return found;
  throw new ResultsFileError('sheet_not_found', `The workbook has no sheet '${wanted}'. Its sheets are: ${names.join(', ')}.`, {
    sheets: names,
  });
}

/**
 * Takes the header, and a units row right under it, off the front of the record stream (blank records before the
 * header are dropped). `isHeader` sees the first non-blank records of the first chunk that has any; the records after
 * the header stream on unchanged.
 */
async function splitHeader(
  chunks: AsyncGenerator<RawRecord[]>,
  isHeader: (firstRecords: RawRecord[]) => boolean,
): Promise<Pick<ResultsTable, 'headerRow' | 'headers' | 'unitsRow' | 'units' | 'records'>> {
  let chunk: RawRecord[];
  let start: number;
  do {
    const next = await chunks.next();
    if (next.done) throw emptyFile();
    chunk = next.value;
    start = chunk.findIndex((record) => !isBlankRecord(record.cells));
  } while (start < 0);
  const lookahead = chunk.slice(start).filter((record) => !isBlankRecord(record.cells)).slice(0, HEADER_LOOKAHEAD);
  const header = isHeader(lookahead) ? chunk[start] : undefined;
  const width = Math.max(...lookahead.map((record) => record.cells.length));
  const headers = header
    ? header.cells.map((cell, index) => cellText(cell) || columnName(index))
    : Array.from({ length: width }, (_, index) => columnName(index));
  let rest = chunk.slice(header ? start + 1 : start);
  // The record under the header may be in the next chunk when chunks are small (a preview of one row).
  while (header && !rest.some((record) => !isBlankRecord(record.cells))) {
    const next = await chunks.next();
    if (next.done) break;
    rest = rest.concat(next.value);
  }
  const unitsRecord = header && rest.find((record) => !isBlankRecord(record.cells));
  const units = unitsRecord && isUnitsRow(unitsRecord.cells) ? unitsRecord : undefined;
  if (units) rest = rest.slice(rest.indexOf(units) + 1);
  return {
    headerRow: header?.row ?? null,
    headers,
    unitsRow: units?.row ?? null,
    units: headers.map((_, index) => cellText(units?.cells[index] ?? null)),
    records: prepend(rest, chunks),
  };
}

/** A record without a single number that names at least one unit: a data record always has a force in it. */
function isUnitsRow(cells: readonly Cell[]): boolean {
  const texts = cells.map(cellText).filter((text) => text !== '');
  return !texts.some(looksNumeric) && texts.some((text) => unitWord(text) !== undefined);
}

async function* prepend(first: RawRecord[], rest: AsyncGenerator<RawRecord[]>): AsyncGenerator<RawRecord[]> {
  try {
    if (first.length > 0) yield first;
    yield* rest;
  } finally {
    await rest.return(undefined);
  }
}

export function isBlankRecord(cells: readonly Cell[]): boolean {
  for (let i = 0; i < cells.length; i++) if (!isBlankCell(cells[i])) return false;
  return true;
}

async function readHead(path: string): Promise<{ head: Buffer; complete: boolean }> {
  const file = await fs.open(path, 'r');
  try {
    const buffer = Buffer.alloc(HEAD_BYTES);
    const { bytesRead } = await file.read(buffer, 0, HEAD_BYTES, 0);
    return { head: buffer.subarray(0, bytesRead), complete: bytesRead < HEAD_BYTES };
  } finally {
    await file.close();
  }
}

function isZip(head: Buffer): boolean {
  return head.length >= 4 && head.readUInt32LE(0) === 0x04034b50;
}

/** The OLE2 compound-file signature of .xls workbooks. */
function isLegacyExcel(head: Buffer): boolean {
  return head.length >= 8 && head.subarray(0, 8).equals(Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]));
}

function emptyFile(): ResultsFileError {
  return new ResultsFileError('empty_file', 'The file is empty: it holds no header and no rows.');
}
