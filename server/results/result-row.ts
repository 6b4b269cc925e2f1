/**
 * One imported result, in SI, and the per-record reading that produces it from a record of the file: one row per
 * record, or in the wide layout one per combination column.
 */
import { toMillimetres, toNewtons } from '../engine/units';
import type { Point3_mm } from '../ifc/model-read-result';
import { type Cell, cellNumber, cellText, type DecimalSeparator, isBlankCell, type RawRecord } from './cell-values';
import type { ColumnMapping, ResolvedColumns } from './column-mapping';
import type { RowIssue } from './results-file-error';
import { toNewtonMillimetres } from './unit-words';

export interface ResultRow {
  /** Row number in the file (in its sheet) as a spreadsheet shows it. */
  row: number;
  /** Index of the row's worksheet among those read, when several are read. */
  sheet?: number;
  memberKey: string;
  combination: string;
  /** Distance along the analysis member, when the file gives stations. */
  station_mm?: number;
  /** Shear along the web, signed as exported; the check uses its magnitude. */
  shear_N: number;
  /** Read when mapped (blank cells stay undefined), for the checks of both axes and of shear with bending. */
  minorShear_N?: number;
  majorMoment_Nmm?: number;
  minorMoment_Nmm?: number;
  end1_mm?: Point3_mm;
  end2_mm?: Point3_mm;
}

/** Reads one record, appending its rows to `rows`; returns the record's problems instead when it has any. */
export type RowReader = (record: RawRecord, rows: ResultRow[]) => RowIssue[] | undefined;

export interface RowContext {
  headers: readonly string[];
  decimalSeparator: DecimalSeparator;
  /** The worksheet read, named in the combination when the mapping says so. */
  sheet?: string;
  /** Names the sheet in every message (when several are read). */
  sheetInMessages?: boolean;
  /** The worksheet's index among those read, given to each row when several are read. */
  sheetIndex?: number;
}

/** Reads records into rows; unit factors and the layout are settled once here, not per row. */
export function createRowReader(mapping: ColumnMapping, columns: ResolvedColumns, context: RowContext): RowReader {
  const { headers, decimalSeparator } = context;
  const newtonsPerUnit = toNewtons(1, mapping.forceUnit);
  const newtonMillimetresPerUnit = mapping.momentUnit ? toNewtonMillimetres(1, mapping.momentUnit) : Number.NaN;
  const millimetresPerUnit = mapping.lengthUnit ? toMillimetres(1, mapping.lengthUnit) : Number.NaN;
  const forceUnit = mapping.forceUnit;
  const where = context.sheetInMessages ? `Sheet '${context.sheet}', row` : 'Row';
  const issue = (row: number, column: number | undefined, code: RowIssue['code'], what: string): RowIssue => {
    const header = column === undefined ? undefined : headers[column];
    const at = header === undefined ? '' : ` (column '${header}')`;
    return { row, ...(context.sheetInMessages && { sheet: context.sheet }), column: header, code, message: `${where} ${row}${at}: ${what}.` };
  };
  const notNumeric = (row: number, column: number, cell: Cell, expected: string) => issue(row, column, 'not_numeric', `'${cellText(cell)}' is not a number; expected ${expected}`);
  /** A mapped number that may be blank (a member without that quantity): undefined then, NaN when not a number. */
  const optionalNumber = (cells: readonly Cell[], column: number | undefined, factor: number): number | undefined => {
    if (column === undefined || isBlankCell(cells[column] ?? null)) return undefined;
    return cellNumber(cells[column] ?? null, decimalSeparator) * factor;
  };
  const shearIssue = (row: number, column: number, cell: Cell) =>
    isBlankCell(cell) ? issue(row, column, 'shear_missing', 'the shear force is empty') : notNumeric(row, column, cell, `a shear force in ${forceUnit}`);
  const optionalColumns = (
    [
      [columns.minorShear, `a shear force in ${forceUnit}`],
      [columns.majorMoment, `a moment in ${mapping.momentUnit}`],
      [columns.minorMoment, `a moment in ${mapping.momentUnit}`],
    ] as Array<[number | undefined, string]>
  ).filter((entry): entry is [number, string] => entry[0] !== undefined);
  const sheetPart = mapping.combinationFromSheet ? (context.sheet ?? '') : '';
  const wide = columns.wide && { columns: columns.wide.columns, combinations: columns.wide.combinations };
  const sheet = context.sheetIndex;

  return (record, rows) => {
    const { row, cells } = record;
    let issues: RowIssue[] | undefined;
    const memberKey = cellText(cells[columns.member] ?? null);
    if (memberKey === '') issues = withIssue(issues, issue(row, columns.member, 'member_missing', 'the member key is empty'));

    let combination = sheetPart;
    if (columns.combination !== undefined) {
      const text = cellText(cells[columns.combination] ?? null);
      if (text === '') issues = withIssue(issues, issue(row, columns.combination, 'combination_missing', 'the load combination is empty'));
      combination = joined(combination, text);
    }
    if (columns.envelope !== undefined) {
      const text = cellText(cells[columns.envelope] ?? null);
      if (text === '') issues = withIssue(issues, issue(row, columns.envelope, 'combination_missing', 'the envelope (max or min) is empty'));
      combination = combination === '' ? `envelope ${text}` : `${combination} ${text}`;
    }

    let station_mm: number | undefined;
    if (columns.station !== undefined) {
      const cell = cells[columns.station] ?? null;
      const station = cellNumber(cell, decimalSeparator);
      if (!Number.isNaN(station)) station_mm = station * millimetresPerUnit;
      else if (!isBlankCell(cell)) issues = withIssue(issues, notNumeric(row, columns.station, cell, 'a station'));
    }

    let ends: Point3_mm[] | undefined;
    if (columns.ends) {
      const endColumns = columns.ends;
      const endCells = endColumns.map((column) => cells[column] ?? null);
      const blanks = endCells.filter(isBlankCell).length;
      if (blanks > 0 && blanks < endCells.length) {
        issues = withIssue(issues, issue(row, undefined, 'coordinates_incomplete', 'give all six end coordinates or none'));
      } else if (blanks === 0) {
        const values = endCells.map((cell) => cellNumber(cell, decimalSeparator) * millimetresPerUnit);
        const bad = values.findIndex(Number.isNaN);
        if (bad >= 0) issues = withIssue(issues, notNumeric(row, endColumns[bad], endCells[bad], 'an end coordinate'));
        else ends = [[values[0], values[1], values[2]], [values[3], values[4], values[5]]];
      }
    }

    const end1_mm = ends?.[0];
    const end2_mm = ends?.[1];

    if (wide) {
      const start = rows.length;
      for (let i = 0; i < wide.columns.length; i++) {
        const column = wide.columns[i];
        const shear = cellNumber(cells[column] ?? null, decimalSeparator);
        if (Number.isNaN(shear)) issues = withIssue(issues, shearIssue(row, column, cells[column] ?? null));
        rows.push({ row, sheet, memberKey, combination: joined(combination, wide.combinations[i]), station_mm, shear_N: shear * newtonsPerUnit, end1_mm, end2_mm });
      }
      if (issues) rows.length = start;
      return issues;
    }

    const shearColumn = columns.shear!;
    const shear = cellNumber(cells[shearColumn] ?? null, decimalSeparator);
    if (Number.isNaN(shear)) issues = withIssue(issues, shearIssue(row, shearColumn, cells[shearColumn] ?? null));
    const minorShear_N = optionalNumber(cells, columns.minorShear, newtonsPerUnit);
    const majorMoment_Nmm = optionalNumber(cells, columns.majorMoment, newtonMillimetresPerUnit);
    const minorMoment_Nmm = optionalNumber(cells, columns.minorMoment, newtonMillimetresPerUnit);
    if (Number.isNaN(minorShear_N) || Number.isNaN(majorMoment_Nmm) || Number.isNaN(minorMoment_Nmm)) {
      for (const [column, expected] of optionalColumns) {
        const cell = cells[column] ?? null;
        if (!isBlankCell(cell) && Number.isNaN(cellNumber(cell, decimalSeparator))) issues = withIssue(issues, notNumeric(row, column, cell, expected));
      }
    }
    if (issues) return issues;
    rows.push({ row, sheet, memberKey, combination, station_mm, shear_N: shear * newtonsPerUnit, minorShear_N, majorMoment_Nmm, minorMoment_Nmm, end1_mm, end2_mm });
    return undefined;
  };
}

function joined(first: string, second: string): string {
  return first === '' ? second : `${first} ${second}`;
}

/** Rows are mostly good: the list is made only for a bad one. */
function withIssue(issues: RowIssue[] | undefined, issue: RowIssue): RowIssue[] {
  const list = issues ?? [];
  list.push(issue);
  return list;
}
