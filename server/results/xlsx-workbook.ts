/**
 * Reading an XLSX results export without loading it: the sheet list comes from the zip's central directory
 * (xl/workbook.xml and its relationships, read at random access, so a million-row workbook lists its sheets at once),
 * and rows stream through exceljs's WorkbookReader.
 */
import fs from 'node:fs';
import type { Readable } from 'node:stream';
import ExcelJS from 'exceljs';
import { XMLParser } from 'fast-xml-parser';
import yauzl from 'yauzl';
import type { Cell, RawRecord } from './cell-values';
import { ResultsFileError } from './results-file-error';

export interface XlsxSheet {
  name: string;
  /** The worksheet part, e.g. 'xl/worksheets/sheet2.xml'. */
  part: string;
}

/** Caps on the two small XML parts read for the sheet list, so a crafted zip cannot make us inflate gigabytes. */
const MAX_WORKBOOK_PART_BYTES = 8 * 1024 * 1024;
const WORKSHEET_RELATIONSHIP = /\/worksheet$/;

const xml = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', removeNSPrefix: true });

/** The workbook's worksheets in tab order (chart sheets have no rows and are left out). */
export async function listXlsxSheets(path: string): Promise<XlsxSheet[]> {
  const parts = await readZipParts(path, ['xl/workbook.xml', 'xl/_rels/workbook.xml.rels']);
  const workbookXml = parts.get('xl/workbook.xml');
  const relsXml = parts.get('xl/_rels/workbook.xml.rels');
  if (workbookXml === undefined || relsXml === undefined) {
    throw unreadableXlsx('it has no workbook part (xl/workbook.xml)');
  }
  const targets = new Map<string, string>();
  for (const rel of asArray(parsePart('xl/_rels/workbook.xml.rels', relsXml)?.Relationships?.Relationship)) {
    if (WORKSHEET_RELATIONSHIP.test(String(rel.Type))) targets.set(String(rel.Id), partPath(String(rel.Target)));
  }
  const sheets: XlsxSheet[] = [];
  for (const sheet of asArray(parsePart('xl/workbook.xml', workbookXml)?.workbook?.sheets?.sheet)) {
    const part = targets.get(String(sheet.id));
    if (part) sheets.push({ name: String(sheet.name), part });
  }
  return sheets;
}

/** Spreadsheet programs never write a DOCTYPE in these parts; one is refused rather than its entities expanded. */
function parsePart(name: string, text: string) {
  if (/<!DOCTYPE/i.test(text)) throw unreadableXlsx(`${name} declares a DOCTYPE`);
  try {
    return xml.parse(text);
  } catch {
    throw unreadableXlsx(`${name} is not well-formed XML`);
  }
}

/** Relationship targets are relative to xl/ unless absolute. */
function partPath(target: string): string {
  return target.startsWith('/') ? target.slice(1) : `xl/${target}`;
}

function asArray(value: unknown): Array<Record<string, unknown>> {
  if (value === undefined || value === null) return [];
  return (Array.isArray(value) ? value : [value]) as Array<Record<string, unknown>>;
}

function unreadableXlsx(why: string): ResultsFileError {
  return new ResultsFileError('unreadable_xlsx', `The XLSX workbook cannot be read: ${why}. Save it again from the spreadsheet program or export CSV.`);
}

function readZipParts(path: string, wanted: readonly string[]): Promise<Map<string, string>> {
  return new Promise((resolve, reject) => {
    yauzl.open(path, { lazyEntries: true, autoClose: true }, (openError, zip) => {
      if (openError || !zip) {
        reject(unreadableXlsx('it is not a valid zip archive'));
        return;
      }
      const found = new Map<string, string>();
      const fail = (why: string) => {
        zip.close();
        reject(unreadableXlsx(why));
      };
      zip.on('error', () => fail('the zip archive is damaged'));
      zip.on('end', () => resolve(found));
      zip.on('entry', (entry: yauzl.Entry) => {
        if (!wanted.includes(entry.fileName)) {
          zip.readEntry();
          return;
        }
        if (entry.uncompressedSize > MAX_WORKBOOK_PART_BYTES) {
          fail(`${entry.fileName} is implausibly large`);
          return;
        }
        zip.openReadStream(entry, (streamError, stream) => {
          if (streamError || !stream) {
            fail(`${entry.fileName} cannot be unpacked`);
            return;
          }
          readAll(stream).then(
            (text) => {
              found.set(entry.fileName, text);
              zip.readEntry();
            },
            () => fail(`${entry.fileName} cannot be unpacked`),
          );
        });
      });
      zip.readEntry();
    });
  });
}

async function readAll(stream: Readable): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

interface StreamedWorksheet extends AsyncIterable<ExcelJS.Row> {
  id: number | string;
  name?: string;
}

/** The rows of one sheet, in chunks; sheet rows keep their own numbers (empty rows are simply absent). */
export async function* xlsxRecordChunks(path: string, sheet: XlsxSheet, chunkSize: number): AsyncGenerator<RawRecord[]> {
  const partNumber = /sheet(\d+)\.xml$/.exec(sheet.part)?.[1];
  const input = fs.createReadStream(path);
  const workbook = new ExcelJS.stream.xlsx.WorkbookReader(input, {
    worksheets: 'emit',
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'ignore',
    entries: 'ignore',
  });
  try {
    for await (const worksheet of workbook as AsyncIterable<unknown> as AsyncIterable<StreamedWorksheet>) {
      // exceljs names a sheet only when it has read xl/workbook.xml first; its id is then the part number.
      const isWanted = worksheet.name !== undefined ? worksheet.name === sheet.name : String(worksheet.id) === partNumber;
      if (!isWanted) {
        // exceljs parses sheets in order from one stream: a skipped sheet must still be read through, or the reader
        // can trip over its half-read part when the machine is busy.
        for await (const _row of worksheet) void _row;
        continue;
      }
      let chunk: RawRecord[] = [];
      for await (const row of worksheet) {
        chunk.push({ row: row.number, cells: rowCells(row) });
        if (chunk.length >= chunkSize) {
          yield chunk;
          chunk = [];
        }
      }
      if (chunk.length > 0) yield chunk;
      return;
    }
  } catch (error) {
    if (error instanceof ResultsFileError) throw error;
    throw unreadableXlsx('its sheet data is damaged');
  } finally {
    input.destroy();
  }
}

function rowCells(row: ExcelJS.Row): Cell[] {
  const values = row.values as ExcelJS.CellValue[];
  const cells: Cell[] = [];
  // exceljs row values are 1-based: index 0 is always empty.
  for (let i = 1; i < values.length; i++) cells.push(xlsxCell(values[i]));
  return cells;
}

/** Plain text or number for every kind of stored cell value (formulas give their cached result). */
export function xlsxCell(value: ExcelJS.CellValue | undefined): Cell {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number' || typeof value === 'string') return value;
  if (typeof value === 'boolean') return value ? 'TRUE' : 'FALSE';
  if (value instanceof Date) return value.toISOString();
  if ('richText' in value) return value.richText.map((run) => run.text).join('');
  if ('result' in value) return xlsxCell(value.result as ExcelJS.CellValue);
  // A formula saved without its computed value: keep its text so the row error shows what the cell holds.
  if ('formula' in value) return `=${value.formula}`;
  if ('sharedFormula' in value) return `=${value.sharedFormula}`;
  if ('text' in value) return typeof value.text === 'string' ? value.text : xlsxCell(value.text as ExcelJS.CellValue);
  if ('error' in value) return String(value.error);
  return null;
}
