/**
 * One imported shear result, in SI, and the per-row reading that produces it from a record of the file.
 */
import { toMillimetres, toNewtons } from '../engine/units';
import type { Point3_mm } from '../ifc/model-read-result';
import { type Cell, cellNumber, cellText, type DecimalSeparator, isBlankCell, type RawRecord } from './cell-values';
import type { ColumnMapping, ResolvedColumns } from './column-mapping';
import type { RowIssue } from './results-file-error';

export interface ResultRow {
  /** Row number in the file as a spreadsheet shows it. */
  row: number;
  memberKey: string;
  combination: string;
  /** Distance along the analysis member, when the file gives stations. */
  station_mm?: number;
  /** Signed, as exported; the check uses its magnitude. */
  shear_N: number;
  end1_mm?: Point3_mm;
  end2_mm?: Point3_mm;
}

export type RowReader = (record: RawRecord) => ResultRow | RowIssue[];

/** Reads records into rows; unit factors are looked up once here, not per row. */
export function createRowReader(
  mapping: ColumnMapping,
  columns: ResolvedColumns,
  headers: readonly string[],
  decimalSeparator: DecimalSeparator,
): RowReader {
  const newtonsPerUnit = toNewtons(1, mapping.forceUnit);
  const millimetresPerUnit = mapping.lengthUnit ? toMillimetres(1, mapping.lengthUnit) : Number.NaN;
  const forceUnit = mapping.forceUnit;

  return (record) => {
    const { row, cells } = record;
    let issues: RowIssue[] | undefined;
    const memberKey = cellText(cells[columns.member] ?? null);
    if (memberKey === '') issues = withIssue(issues, issue(row, headers[columns.member], 'member_missing', 'the member key is empty'));
    const combination = cellText(cells[columns.combination] ?? null);
    if (combination === '') {
      issues = withIssue(issues, issue(row, headers[columns.combination], 'combination_missing', 'the load combination is empty'));
    }
    const shearCell = cells[columns.shear] ?? null;
    const shear = cellNumber(shearCell, decimalSeparator);
    if (isBlankCell(shearCell)) issues = withIssue(issues, issue(row, headers[columns.shear], 'shear_missing', 'the shear force is empty'));
    else if (Number.isNaN(shear)) issues = withIssue(issues, notNumeric(row, headers[columns.shear], shearCell, `a shear force in ${forceUnit}`));

    let station_mm: number | undefined;
    if (columns.station !== undefined) {
      const cell = cells[columns.station] ?? null;
      const station = cellNumber(cell, decimalSeparator);
      if (!Number.isNaN(station)) station_mm = station * millimetresPerUnit;
      else if (!isBlankCell(cell)) issues = withIssue(issues, notNumeric(row, headers[columns.station], cell, 'a station'));
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
        if (bad >= 0) issues = withIssue(issues, notNumeric(row, headers[endColumns[bad]], endCells[bad], 'an end coordinate'));
        else ends = [[values[0], values[1], values[2]], [values[3], values[4], values[5]]];
      }
    }

    if (issues) return issues;
    return { row, memberKey, combination, station_mm, shear_N: shear * newtonsPerUnit, end1_mm: ends?.[0], end2_mm: ends?.[1] };
  };
}

/** Rows are mostly good: the list is made only for a bad one. */
function withIssue(issues: RowIssue[] | undefined, issue: RowIssue): RowIssue[] {
  const list = issues ?? [];
  list.push(issue);
  return list;
}

function issue(row: number, column: string | undefined, code: RowIssue['code'], what: string): RowIssue {
  const where = column === undefined ? '' : ` (column '${column}')`;
  return { row, column, code, message: `Row ${row}${where}: ${what}.` };
}

function notNumeric(row: number, column: string, cell: Cell, expected: string): RowIssue {
  return issue(row, column, 'not_numeric', `'${cellText(cell)}' is not a number; expected ${expected}`);
}
