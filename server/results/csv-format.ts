/**
 * Sniffing a CSV export from the first kilobytes: text encoding, delimiter, decimal separator and whether the first
 * record is a header. Analysis programs export with whatever the user's locale dictates ('1,5' with ';' in much of
 * Europe), so nothing here is assumed from the file name.
 */
import { parse } from 'csv-parse/sync';
import { type DecimalSeparator, looksNumeric } from './cell-values';
import { ResultsFileError } from './results-file-error';

export type Delimiter = ',' | ';' | '\t' | '|';
export type TextEncoding = 'utf8' | 'utf16le';

export const DELIMITERS: readonly Delimiter[] = [',', ';', '\t', '|'];

export interface CsvFormat {
  encoding: TextEncoding;
  delimiter: Delimiter;
  decimalSeparator: DecimalSeparator;
  hasHeaderRow: boolean;
}

/** Preference when two delimiters split the sample equally well: a comma is the likeliest to sit inside values. */
const TIE_ORDER: readonly Delimiter[] = ['\t', ';', '|', ','];
const SAMPLE_RECORDS = 50;

/** The encoding named by the byte-order mark (UTF-8 without one); other Unicode forms get a clear error. */
export function detectEncoding(head: Uint8Array): TextEncoding {
  if (head[0] === 0xff && head[1] === 0xfe) {
    if (head[2] === 0 && head[3] === 0) throw unsupportedEncoding('UTF-32');
    return 'utf16le';
  }
  if ((head[0] === 0xfe && head[1] === 0xff) || (head[0] === 0 && head[1] === 0 && head[2] === 0xfe)) {
    throw unsupportedEncoding('big-endian UTF-16 or UTF-32');
  }
  if (head.subarray(0, 4096).includes(0)) {
    throw new ResultsFileError(
      'unsupported_format',
      'The file is neither a text (CSV) file nor an XLSX workbook. Export the results as CSV or XLSX.',
    );
  }
  return 'utf8';
}

function unsupportedEncoding(name: string): ResultsFileError {
  return new ResultsFileError(
    'unsupported_encoding',
    `The file is encoded as ${name}. Save it as UTF-8 (or UTF-16 little-endian) text and upload it again.`,
  );
}

/**
 * Delimiter, decimal separator and header row of a sample (BOM removed). `complete` says the sample is the whole
 * file; otherwise its last, possibly cut, line is ignored.
 */
export function sniffCsvFormat(sample: string, complete: boolean): Omit<CsvFormat, 'encoding'> {
  const text = complete ? sample : sample.slice(0, Math.max(0, sample.lastIndexOf('\n')));
  const delimiter = sniffDelimiter(text);
  const records = sampleRecords(text, delimiter);
  const hasHeaderRow = firstRecordIsHeader(records);
  const data = hasHeaderRow ? records.slice(1) : records;
  return { delimiter, decimalSeparator: delimiter === ',' ? '.' : sniffDecimalSeparator(data), hasHeaderRow };
}

export function sniffDelimiter(text: string): Delimiter {
  let best: { delimiter: Delimiter; consistency: number; fields: number } | undefined;
  for (const delimiter of TIE_ORDER) {
    const counts = sampleRecords(text, delimiter).map((record) => record.length);
    const fields = modeOf(counts);
    if (fields < 2) continue;
    const consistency = counts.filter((count) => count === fields).length / counts.length;
    const better =
      !best || consistency > best.consistency || (consistency === best.consistency && fields > best.fields);
    if (better) best = { delimiter, consistency, fields };
  }
  return best?.delimiter ?? ',';
}

/**
 * Non-blank records of the sample. A sample that does not parse as a whole (an unclosed quote swallows the rest) is
 * parsed line by line, dropping the lines that fail, so the format is still found and the reader can then report the
 * broken line itself.
 */
function sampleRecords(text: string, delimiter: Delimiter): string[][] {
  const parseSample = (sample: string): string[][] =>
    parse(sample, { delimiter, relax_column_count: true, relax_quotes: true, skip_empty_lines: true, to: SAMPLE_RECORDS });
  let records: string[][];
  try {
    records = parseSample(text);
  } catch {
    records = text
      .split(/\r?\n/)
      .slice(0, SAMPLE_RECORDS)
      .flatMap((line) => {
        try {
          return parseSample(line);
        } catch {
          return [];
        }
      });
  }
  return records.filter((record) => record.some((cell) => cell.trim() !== ''));
}

function modeOf(values: number[]): number {
  const tally = new Map<number, number>();
  let mode = 0;
  let modeCount = 0;
  for (const value of values) {
    const count = (tally.get(value) ?? 0) + 1;
    tally.set(value, count);
    if (count > modeCount || (count === modeCount && value > mode)) {
      mode = value;
      modeCount = count;
    }
  }
  return mode;
}

/**
 * A first record without any number is a header. When no record has a number either the file cannot tell; results
 * exports carry a header far more often than not, so it is taken as one (and a wrong guess shows in the preview).
 */
export function firstRecordIsHeader(records: readonly (readonly string[])[]): boolean {
  const [first] = records;
  return first !== undefined && !first.some((cell) => cell.trim() !== '' && looksNumeric(cell));
}

function sniffDecimalSeparator(data: readonly (readonly string[])[]): DecimalSeparator {
  let commas = 0;
  let points = 0;
  for (const record of data) {
    for (const cell of record) {
      if (!looksNumeric(cell)) continue;
      if (cell.includes(',')) commas++;
      else if (cell.includes('.')) points++;
    }
  }
  return commas > points ? ',' : '.';
}
