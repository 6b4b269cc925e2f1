/**
 * Cells and records of a results file, as both readers hand it over: CSV cells are text, XLSX cells text or numbers.
 * Numbers are read strictly (no thousands separators, no hex, no 'Infinity'), so a typo is reported, never guessed.
 */

export type Cell = string | number | null;

export type DecimalSeparator = '.' | ',';

/** One record of a file: `row` is the number a spreadsheet shows for it (1-based, header included). */
export interface RawRecord {
  row: number;
  cells: Cell[];
}

const DECIMAL_POINT_NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const DECIMAL_COMMA_NUMBER = /^[+-]?(?:\d+,?\d*|,\d+)(?:[eE][+-]?\d+)?$/;

export function cellText(cell: Cell): string {
  if (cell === null) return '';
  return typeof cell === 'number' ? String(cell) : trimmed(cell);
}

export function isBlankCell(cell: Cell): boolean {
  if (cell === null) return true;
  if (typeof cell === 'number') return false;
  return cell.length === 0 || (mayHaveSpaceAt(cell, 0) && cell.trim() === '');
}

/** The number in a cell, or NaN when the cell holds anything else (blank cells included: test isBlankCell first). */
export function cellNumber(cell: Cell, decimalSeparator: DecimalSeparator): number {
  if (typeof cell === 'number') return Number.isFinite(cell) ? cell : Number.NaN;
  if (cell === null) return Number.NaN;
  return parseDecimal(trimmed(cell), decimalSeparator);
}

/**
 * Text without surrounding white space. Almost every cell has none, and this runs for millions of cells, so trim()
 * (which allocates) is called only when an end character is a control, space or non-ASCII character.
 */
function trimmed(text: string): string {
  return text.length > 0 && (mayHaveSpaceAt(text, 0) || mayHaveSpaceAt(text, text.length - 1)) ? text.trim() : text;
}

function mayHaveSpaceAt(text: string, index: number): boolean {
  const code = text.charCodeAt(index);
  return code <= 32 || code >= 127;
}

export function parseDecimal(text: string, decimalSeparator: DecimalSeparator): number {
  if (decimalSeparator === ',') {
    return DECIMAL_COMMA_NUMBER.test(text) ? Number(text.replace(',', '.')) : Number.NaN;
  }
  return DECIMAL_POINT_NUMBER.test(text) ? Number(text) : Number.NaN;
}

/** True when the text reads as a number with either decimal separator; used to tell a header row from data. */
export function looksNumeric(text: string): boolean {
  const trimmed = text.trim();
  return DECIMAL_POINT_NUMBER.test(trimmed) || DECIMAL_COMMA_NUMBER.test(trimmed);
}
