/**
 * Project catalogue upload: a CSV with the header
 *   name,series,depth_mm,width_mm,web_mm,flange_mm,root_radius_mm
 * one rolled section per row. Either every row is valid and all are returned, or CatalogueCsvError lists every
 * problem with its line number, so nothing half-read is ever stored.
 */
import { parse } from 'csv-parse/sync';
import { EngineInputError } from '../engine/input-error';
import { SectionInputError, validateSection } from '../engine/section';
import type { CatalogueSection } from './catalogue-section';
import { sectionKey, toSectionInput } from './catalogue';

export const CATALOGUE_CSV_COLUMNS = ['name', 'series', 'depth_mm', 'width_mm', 'web_mm', 'flange_mm', 'root_radius_mm'] as const;
type Column = (typeof CATALOGUE_CSV_COLUMNS)[number];

/** Largest project catalogue accepted; real ones hold a few hundred sections. */
export const MAX_CATALOGUE_ROWS = 5000;

export interface CatalogueCsvProblem {
  /** 1-based line number in the file (the header is line 1). */
  line: number;
  column: Column | null;
  message: string;
}

export class CatalogueCsvError extends EngineInputError {
  constructor(readonly problems: readonly CatalogueCsvProblem[]) {
    super(
      'catalogue',
      `The catalogue file has ${problems.length} problem${problems.length === 1 ? '' : 's'}: ` +
        problems
          .slice(0, 5)
          .map((p) => `line ${p.line}${p.column ? ` (${p.column})` : ''}: ${p.message}`)
          .join('; ') +
        (problems.length > 5 ? '; …' : ''),
    );
    this.name = 'CatalogueCsvError';
  }
}

/** Section-input fields as the CSV names them, so geometry errors point at a column. */
const COLUMN_OF_FIELD: Readonly<Record<string, Column>> = {
  depth_mm: 'depth_mm',
  webThickness_mm: 'web_mm',
  'topFlange.width_mm': 'width_mm',
  'topFlange.thickness_mm': 'flange_mm',
  'topFlange.filletRadius_mm': 'root_radius_mm',
};

const NUMERIC_COLUMNS: readonly Column[] = ['depth_mm', 'width_mm', 'web_mm', 'flange_mm', 'root_radius_mm'];

interface ParsedRecord {
  record: string[];
  info: { lines: number };
}

function readRecords(text: string): ParsedRecord[] {
  try {
    return parse(text, { bom: true, trim: true, skip_empty_lines: true, relax_column_count: true, info: true }) as unknown as ParsedRecord[];
  } catch (error) {
    const line = (error as { lines?: number }).lines ?? 1;
    throw new CatalogueCsvError([{ line, column: null, message: `not readable as CSV (${(error as Error).message})` }]);
  }
}

function checkHeader(header: readonly string[] | undefined): void {
  const got = (header ?? []).map((h) => h.toLowerCase());
  const missing = CATALOGUE_CSV_COLUMNS.filter((c) => !got.includes(c));
  const unknown = got.filter((h) => !(CATALOGUE_CSV_COLUMNS as readonly string[]).includes(h));
  if (missing.length > 0 || unknown.length > 0 || got.length !== CATALOGUE_CSV_COLUMNS.length) {
    const parts = [
      missing.length ? `missing ${missing.join(', ')}` : '',
      unknown.length ? `unknown ${unknown.join(', ')}` : '',
    ].filter(Boolean);
    throw new CatalogueCsvError([
      { line: 1, column: null, message: `header must be ${CATALOGUE_CSV_COLUMNS.join(',')}${parts.length ? ` (${parts.join('; ')})` : ''}` },
    ]);
  }
}

/** Parses an uploaded project catalogue; throws CatalogueCsvError listing every bad line. */
export function parseCatalogueCsv(text: string): CatalogueSection[] {
  const records = readRecords(text);
  if (records.length === 0) throw new CatalogueCsvError([{ line: 1, column: null, message: 'the file is empty' }]);
  checkHeader(records[0].record);
  const order = records[0].record.map((h) => h.toLowerCase() as Column);
  const rows = records.slice(1);
  if (rows.length === 0) throw new CatalogueCsvError([{ line: 2, column: null, message: 'the file has a header but no sections' }]);
  if (rows.length > MAX_CATALOGUE_ROWS) {
    throw new CatalogueCsvError([{ line: 1, column: null, message: `at most ${MAX_CATALOGUE_ROWS} sections per file, got ${rows.length}` }]);
  }

  const problems: CatalogueCsvProblem[] = [];
  const sections: CatalogueSection[] = [];
  const seen = new Map<string, number>();
  for (const { record, info } of rows) {
    const line = info.lines;
    if (record.length !== order.length) {
      problems.push({ line, column: null, message: `expected ${order.length} values, got ${record.length}` });
      continue;
    }
    const cell = Object.fromEntries(order.map((c, i) => [c, record[i]])) as Record<Column, string>;
    const before = problems.length;
    for (const column of ['name', 'series'] as const) {
      if (cell[column] === '') problems.push({ line, column, message: 'must not be empty' });
    }
    const numbers = {} as Record<Column, number>;
    for (const column of NUMERIC_COLUMNS) {
      const value = Number(cell[column]);
      if (cell[column] === '' || !Number.isFinite(value)) {
        problems.push({ line, column, message: `must be a number of millimetres, got '${cell[column]}'` });
      }
      numbers[column] = value;
    }
    if (problems.length > before) continue;
    const section: CatalogueSection = {
      name: cell.name,
      series: cell.series,
      depth_mm: numbers.depth_mm,
      width_mm: numbers.width_mm,
      webThickness_mm: numbers.web_mm,
      flangeThickness_mm: numbers.flange_mm,
      rootRadius_mm: numbers.root_radius_mm,
      sourceId: 'project',
    };
    try {
      validateSection(toSectionInput(section));
    } catch (error) {
      if (!(error instanceof SectionInputError)) throw error;
      problems.push({ line, column: COLUMN_OF_FIELD[error.field] ?? null, message: error.message });
      continue;
    }
    const key = sectionKey(section.name);
    const first = seen.get(key);
    if (first !== undefined) {
      problems.push({ line, column: 'name', message: `'${section.name}' is already defined on line ${first}` });
      continue;
    }
    seen.set(key, line);
    sections.push(section);
  }
  if (problems.length > 0) throw new CatalogueCsvError(problems);
  return sections;
}
