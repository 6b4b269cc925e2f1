/**
 * How the columns of a results file are read: which column holds the member key, what names the load combination,
 * the station, the forces and in which units. A mapping names columns by their header text, so a user can save it
 * once as a template (or write it by hand for the command line) and reuse it for every export of the same analysis
 * program.
 *
 * The combination of a row is built from the parts the mapping names, in this order, joined by a space: the sheet's
 * name (`combinationFromSheet`), the combination column, the envelope column ('max', 'min'; alone it reads
 * 'envelope max'), and in the wide layout the combination column's own name (`combinationColumns`: one column of web
 * shear per combination, 'Vz CO1 [kN]' naming 'CO1').
 */
import { z } from 'zod';
import { FORCE_UNITS, type ForceUnit, LENGTH_UNITS, type LengthUnit } from '../engine/units';
import { ResultsFileError } from './results-file-error';
import { MOMENT_UNITS, type MomentUnit, unitWord } from './unit-words';

export const MEMBER_KEY_KINDS = ['auto', 'globalId', 'tag', 'name'] as const;
export type MemberKeyKind = (typeof MEMBER_KEY_KINDS)[number];

const columnRef = z.string().trim().min(1, 'choose a column').max(200);

export const END_COLUMNS = ['x1', 'y1', 'z1', 'x2', 'y2', 'z2'] as const;
export type EndColumn = (typeof END_COLUMNS)[number];

const endColumnsSchema = z.strictObject({ x1: columnRef, y1: columnRef, z1: columnRef, x2: columnRef, y2: columnRef, z2: columnRef });

const unitError = (what: string, units: readonly string[]) => (issue: { input: unknown }) =>
  `unknown ${what} unit ${JSON.stringify(issue.input)}; use one of ${units.join(', ')}`;

export const columnMappingSchema = z
  .strictObject({
    memberColumn: columnRef,
    /** The load combination (or load case) named on each row. */
    combinationColumn: columnRef.optional(),
    /** Envelope rows: 'max' or 'min' instead of (or besides) a combination. */
    envelopeColumn: columnRef.optional(),
    /** Wide layout: one column per combination, each holding the shear along the web. */
    combinationColumns: z.array(columnRef).min(1).max(1000).optional(),
    /** Workbooks with one sheet per combination: the sheet's name is (part of) the combination. */
    combinationFromSheet: z.boolean().optional(),
    /** XLSX: the worksheets read, each with this mapping; without it, the sheet chosen with the file (or the only one). */
    sheets: z.array(z.string().trim().min(1).max(255)).min(1).max(200).optional(),
    stationColumn: columnRef.optional(),
    /** The shear force along the web (major-axis shear, Vz in EN 1993 member axes). */
    shearColumn: columnRef.optional(),
    /** The shear across the flanges (minor-axis shear, Vy). */
    minorShearColumn: columnRef.optional(),
    /** Bending about the major axis (My) and the minor axis (Mz). */
    majorMomentColumn: columnRef.optional(),
    minorMomentColumn: columnRef.optional(),
    /** Analysis member end points, for matching by geometry. */
    endColumns: endColumnsSchema.optional(),
    forceUnit: z.enum(FORCE_UNITS, { error: unitError('force', FORCE_UNITS) }),
    /** Unit of the moment columns; required when one is mapped. */
    momentUnit: z.enum(MOMENT_UNITS, { error: unitError('moment', MOMENT_UNITS) }).optional(),
    /** Unit of the station and end-coordinate columns; required when either is mapped. */
    lengthUnit: z.enum(LENGTH_UNITS, { error: unitError('length', LENGTH_UNITS) }).optional(),
    /** What the member key column holds, if known; 'auto' tries GlobalId, then Tag, then Name. */
    memberKeyKind: z.enum(MEMBER_KEY_KINDS).default('auto'),
  })
  .superRefine((mapping, ctx) => {
    const problem = (path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });
    if (!mapping.combinationColumn && !mapping.envelopeColumn && !mapping.combinationColumns && !mapping.combinationFromSheet) {
      problem('combinationColumn', 'choose the load combination column (or an envelope column, one column per combination, or combinationFromSheet)');
    }
    if (mapping.combinationColumns) {
      for (const role of ['shearColumn', 'minorShearColumn', 'majorMomentColumn', 'minorMomentColumn'] as const) {
        if (mapping[role]) problem(role, 'leave it out: with one column per combination, those columns hold the shear along the web');
      }
    } else if (!mapping.shearColumn) {
      problem('shearColumn', 'choose the shear force column');
    }
    if ((mapping.majorMomentColumn || mapping.minorMomentColumn) && !mapping.momentUnit) problem('momentUnit', 'choose the unit of the moment columns');
    if ((mapping.stationColumn || mapping.endColumns) && !mapping.lengthUnit) problem('lengthUnit', 'choose the length unit of the station and coordinate columns');
    const used = new Map<string, string>();
    for (const [role, column] of mappedColumns(mapping)) {
      const other = used.get(normalizeHeader(column));
      if (other) problem(role, `column '${column}' is already used for ${other}`);
      else used.set(normalizeHeader(column), role);
    }
  });

export type ColumnMapping = z.output<typeof columnMappingSchema>;

const SINGLE_COLUMN_ROLES = [
  'memberColumn',
  'combinationColumn',
  'envelopeColumn',
  'stationColumn',
  'shearColumn',
  'minorShearColumn',
  'majorMomentColumn',
  'minorMomentColumn',
] as const;

function mappedColumns(mapping: Partial<ColumnMapping>): Array<[string, string]> {
  const roles: Array<[string, string | undefined]> = [
    ...SINGLE_COLUMN_ROLES.map((role): [string, string | undefined] => [role, mapping[role]]),
    ...(mapping.combinationColumns ?? []).map((column, i): [string, string] => [`combinationColumns.${i}`, column]),
    ...END_COLUMNS.map((end): [string, string | undefined] => [`endColumns.${end}`, mapping.endColumns?.[end]]),
  ];
  return roles.filter((role): role is [string, string] => role[1] !== undefined);
}

/** Validates a mapping from a request, a saved template or the command line; throws `invalid_mapping` listing every problem. */
export function parseColumnMapping(input: unknown): ColumnMapping {
  const result = columnMappingSchema.safeParse(input);
  if (result.success) return result.data;
  const problems = result.error.issues.map((issue) => (issue.path.length ? `${issue.path.join('.')}: ${issue.message}` : issue.message));
  throw new ResultsFileError('invalid_mapping', `The column mapping is not usable: ${problems.join('; ')}.`);
}

/** Header text compared loosely: case, surrounding and repeated spaces do not matter. */
export function normalizeHeader(header: string): string {
  return header.trim().replace(/\s+/g, ' ').toLowerCase();
}

export interface ResolvedColumns {
  member: number;
  combination?: number;
  envelope?: number;
  station?: number;
  shear?: number;
  minorShear?: number;
  majorMoment?: number;
  minorMoment?: number;
  /** Wide layout: the combination columns, and the combination each names. */
  wide?: { columns: number[]; combinations: string[] };
  /** x1, y1, z1, x2, y2, z2. */
  ends?: number[];
}

/** Column indices of a mapping in a file's header; a missing or doubled header is a file error naming the columns. */
export function resolveColumns(mapping: ColumnMapping, headers: readonly string[]): ResolvedColumns {
  const index = (column: string): number => {
    const wanted = normalizeHeader(column);
    const found = headers.flatMap((header, i) => (normalizeHeader(header) === wanted ? [i] : []));
    if (found.length === 1) return found[0];
    const code = found.length === 0 ? 'column_missing' : 'column_ambiguous';
    const why = found.length === 0 ? `has no column '${column}'` : `has ${found.length} columns called '${column}'`;
    throw new ResultsFileError(code, `The file ${why}. Its columns are: ${headers.join(', ')}. Adjust the column mapping.`, {
      columns: [...headers],
    });
  };
  const optional = (column: string | undefined) => (column === undefined ? undefined : index(column));
  return {
    member: index(mapping.memberColumn),
    combination: optional(mapping.combinationColumn),
    envelope: optional(mapping.envelopeColumn),
    station: optional(mapping.stationColumn),
    shear: optional(mapping.shearColumn),
    minorShear: optional(mapping.minorShearColumn),
    majorMoment: optional(mapping.majorMomentColumn),
    minorMoment: optional(mapping.minorMomentColumn),
    wide: mapping.combinationColumns && wideColumns(mapping.combinationColumns, index),
    ends: mapping.endColumns && END_COLUMNS.map((end) => index(mapping.endColumns![end])),
  };
}

function wideColumns(columns: readonly string[], index: (column: string) => number): NonNullable<ResolvedColumns['wide']> {
  const combinations = columns.map(combinationOfColumn);
  const first = new Map<string, string>();
  columns.forEach((column, i) => {
    const earlier = first.get(combinations[i]);
    if (earlier !== undefined) {
      throw new ResultsFileError('invalid_mapping', `The columns '${earlier}' and '${column}' both name combination '${combinations[i]}'. Map only one of them.`);
    }
    first.set(combinations[i], column);
  });
  return { columns: columns.map(index), combinations };
}

// --- Header words ------------------------------------------------------------------------------------------------

/** A unit at the end of a header: 'V [kN]', 'shear (kip)', 'My [kN·m]', 'station_m', 'x1 mm'. */
const BRACKETED_UNIT = /[[(]\s*([^\])]+?)\s*[\])]\s*$/;
const TRAILING_UNIT = /[\s_]([a-z]+)$/i;

interface HeaderWords {
  header: string;
  /** Lower case words without the unit, as the alias lists spell them ('Vz,Ed [kN]' → 'vz ed'). */
  name: string;
  unit?: string;
}

function headerWords(header: string, unitsRowCell?: string): HeaderWords {
  const text = header.trim();
  const fromRow = unitsRowCell?.trim() ? unitsRowCell.trim() : undefined;
  const bracketed = BRACKETED_UNIT.exec(text);
  if (bracketed) return { header, name: aliasForm(text.slice(0, bracketed.index)), unit: fromRow ?? bracketed[1] };
  const trailing = TRAILING_UNIT.exec(text);
  if (trailing && unitWord(trailing[1]) && trailing.index > 0) return { header, name: aliasForm(text.slice(0, trailing.index)), unit: fromRow ?? trailing[1] };
  return { header, name: aliasForm(text), unit: fromRow };
}

function aliasForm(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();
}

/** Names of the web shear, as a wide layout puts them before or after the combination ('Vz CO1', 'ULS-2 V'). */
const SHEAR_WORDS = new Set(['v', 'vz', 'shear', 'ved', 'fz', 'q', 'qz']);

/** The combination a wide-layout column names: its header without the unit and without a leading or trailing shear word. */
export function combinationOfColumn(header: string): string {
  const words = header.trim().replace(BRACKETED_UNIT, '').trim().split(/[\s_]+/);
  if (words.length > 1 && SHEAR_WORDS.has(aliasForm(words[0]))) words.shift();
  if (words.length > 1 && SHEAR_WORDS.has(aliasForm(words[words.length - 1]))) words.pop();
  return words.join(' ') || header.trim();
}

function namesShear(header: string): boolean {
  return combinationOfColumn(header) !== header.trim().replace(BRACKETED_UNIT, '').trim();
}

// --- Guessing a mapping from the header ---------------------------------------------------------------------------

type QuantityRole = 'shearColumn' | 'minorShearColumn' | 'majorMomentColumn' | 'minorMomentColumn';

/** Header names (normalized, units removed) per role, most specific first. */
const MEMBER_ALIASES = ['member', 'member key', 'member id', 'member no', 'globalid', 'global id', 'ifc globalid', 'guid', 'ifc guid', 'tag', 'mark', 'piece mark', 'member name', 'name', 'element', 'element id', 'beam', 'bar', 'id', 'label'];
const COMBINATION_ALIASES = ['combination', 'load combination', 'combination name', 'combo', 'load combo', 'comb'];
const LOAD_CASE_ALIASES = ['load case', 'loadcase', 'case', 'lc'];
const ENVELOPE_ALIASES = ['envelope', 'env', 'max min', 'min max', 'maxmin', 'extreme', 'extremum'];
const STATION_ALIASES = ['station', 'position', 'distance', 'location', 'pos', 'dist', 'loc', 'x', 's'];
// EN 1993-1-1 §1.7 member axes: y-y is the major axis and z runs along the web, so Vz (Fz) is the shear the web
// carries and My the major-axis moment.
const QUANTITY_ALIASES: Record<QuantityRole, readonly string[]> = {
  shearColumn: ['shear', 'shear force', 'ved', 'v ed', 'v', 'vz', 'vz ed', 'v z', 'fz', 'q', 'qz'],
  minorShearColumn: ['vy', 'vy ed', 'v y', 'fy', 'qy'],
  majorMomentColumn: ['my', 'my ed', 'm y', 'moment', 'bending moment', 'm', 'med', 'm ed'],
  minorMomentColumn: ['mz', 'mz ed', 'm z'],
};
// Numbered local axes: 2 is usually the web direction, V2 paired with M3 (common practice, no source), but an export
// cannot show it, so these are only proposed.
const NUMBERED_AXIS_ALIASES: Record<QuantityRole, readonly string[]> = {
  shearColumn: ['v2', 'f2'],
  minorShearColumn: ['v3', 'f3'],
  majorMomentColumn: ['m3'],
  minorMomentColumn: ['m2'],
};
const QUANTITY_ROLES = Object.keys(QUANTITY_ALIASES) as QuantityRole[];

const KEY_KIND_OF_ALIAS: Readonly<Record<string, MemberKeyKind>> = {
  globalid: 'globalId',
  'global id': 'globalId',
  'ifc globalid': 'globalId',
  guid: 'globalId',
  'ifc guid': 'globalId',
  tag: 'tag',
  mark: 'tag',
  'piece mark': 'tag',
  name: 'name',
  'member name': 'name',
};

const END_ALIASES: Record<EndColumn, readonly string[]> = {
  x1: ['x1', 'xi', 'x start', 'start x'],
  y1: ['y1', 'yi', 'y start', 'start y'],
  z1: ['z1', 'zi', 'z start', 'start z'],
  x2: ['x2', 'xj', 'x end', 'end x'],
  y2: ['y2', 'yj', 'y end', 'end y'],
  z2: ['z2', 'zj', 'z end', 'end z'],
};

export type MissingField = 'memberColumn' | 'combinationColumn' | 'shearColumn' | 'forceUnit' | 'lengthUnit' | 'momentUnit';

/** A choice the header leaves open; the mapping proposes `columns[0]` (or all of them for combinationColumns). */
export interface MappingQuestion {
  field: keyof ColumnMapping;
  columns: string[];
  why: string;
}

export interface MappingGuess {
  /** What could be read from the header; the user completes the rest. */
  mapping: Partial<ColumnMapping>;
  /** Required fields the header did not reveal. */
  missing: MissingField[];
  /** Choices made on a guess: the mapping is to be confirmed, not used as it stands. */
  unsure: MappingQuestion[];
}

export interface GuessContext {
  /** The units row under the header, per column ('' where it gives none). */
  units?: readonly string[];
  /** Several sheets are read with this mapping: without a combination column, the sheet names are the combinations. */
  severalSheets?: boolean;
}

/**
 * A mapping guessed from header names: the default format (`member,combination,shear`, optional `station`), the names
 * analysis exports usually give these columns, the wide layout (one column per combination) and envelope rows, with
 * units from brackets, suffixes or a units row. Where two columns fit one role, or a name does not settle it, the
 * guess says so in `unsure` rather than choosing silently.
 */
export function guessMapping(headers: readonly string[], context: GuessContext = {}): MappingGuess {
  const words = headers.map((header, i) => headerWords(header, context.units?.[i]));
  const taken = new Set<number>();
  const unsure: MappingQuestion[] = [];
  const matching = (aliases: readonly string[]): number[] =>
    aliases.flatMap((alias) => words.flatMap((word, i) => (!taken.has(i) && word.name === alias ? [i] : [])));
  const take = (index: number | undefined): HeaderWords | undefined => {
    if (index === undefined) return undefined;
    taken.add(index);
    return words[index];
  };
  const ask = (field: keyof ColumnMapping, indices: number[], why: string) => unsure.push({ field, columns: indices.map((i) => headers[i]), why });
  const pickOne = (field: keyof ColumnMapping, candidates: number[], what: string): HeaderWords | undefined => {
    if (candidates.length > 1) ask(field, candidates, `each could be ${what}`);
    return take(candidates[0]);
  };

  const member = take(matching(MEMBER_ALIASES)[0]);
  const combination = pickOne('combinationColumn', [...matching(COMBINATION_ALIASES), ...matching(LOAD_CASE_ALIASES)], 'the load combination');
  const envelope = pickOne('envelopeColumn', matching(ENVELOPE_ALIASES), 'the envelope (max/min)');
  const station = pickOne('stationColumn', matching(STATION_ALIASES), 'the distance along the member');
  const names = new Set(words.map((word) => word.name));
  if (station?.name === 'x' && names.has('y') && names.has('z')) {
    ask('stationColumn', [headers.indexOf(station.header)], `'${station.header}' may be a coordinate, not a distance along the member: the file also has y and z columns`);
  }

  const quantities: Partial<Record<QuantityRole, HeaderWords>> = {};
  const numbered: number[] = [];
  for (const role of QUANTITY_ROLES) {
    const named = matching(QUANTITY_ALIASES[role]);
    const byNumber = matching(NUMBERED_AXIS_ALIASES[role]);
    if (named.length === 0) numbered.push(...byNumber.slice(0, 1));
    quantities[role] = pickOne(role, [...named, ...byNumber], role === 'shearColumn' ? 'the shear along the web' : `the ${role.replace('Column', '')}`);
  }
  if (numbered.length > 0) {
    ask('shearColumn', numbered, 'numbered local axes do not say which shear runs along the web; axis 2 (V2 with M3) is proposed, as is common');
  }

  const ends = END_COLUMNS.map((end) => take(matching(END_ALIASES[end])[0]));
  const endColumns = ends.every((end) => end !== undefined)
    ? (Object.fromEntries(END_COLUMNS.map((end, i) => [end, ends[i]!.header])) as Record<EndColumn, string>)
    : undefined;

  // No combination and no shear column: the other columns are read as one column of shear per combination.
  let wide: HeaderWords[] | undefined;
  if (member && !combination && !envelope && !quantities.shearColumn && !context.severalSheets) {
    const rest = words.filter((_, i) => !taken.has(i));
    if (rest.length > 0) {
      wide = rest;
      if (!rest.every((word) => namesShear(word.header))) {
        ask('combinationColumns', rest.map((word) => headers.indexOf(word.header)), 'no column names the combination or the shear: these are taken as one column of shear along the web per combination');
      }
    }
  }
  const combinationFromSheet = context.severalSheets === true && !combination && !envelope;

  const unitOf = <K extends 'force' | 'length' | 'moment'>(field: keyof ColumnMapping, kind: K, columns: Array<HeaderWords | undefined>) => {
    const units = new Set<string>();
    for (const column of columns) {
      if (column?.unit === undefined) continue;
      const unit = unitWord(column.unit);
      if (unit && unit.kind !== kind) ask(field, [headers.indexOf(column.header)], `'${column.header}' is in ${column.unit}, not a ${kind} unit`);
      else if (unit) units.add(unit.unit);
    }
    if (units.size > 1) ask(field, columns.flatMap((column) => (column ? [headers.indexOf(column.header)] : [])), `the columns give different units (${[...units].join(', ')})`);
    return units.size === 1 ? ([...units][0] as Extract<ReturnType<typeof unitWord>, { kind: K }>['unit']) : undefined;
  };
  const forceUnit = unitOf('forceUnit', 'force', [quantities.shearColumn, quantities.minorShearColumn, ...(wide ?? [])]) as ForceUnit | undefined;
  const lengthUnit = unitOf('lengthUnit', 'length', [station, ...(endColumns ? ends : [])]) as LengthUnit | undefined;
  const momentColumns = [quantities.majorMomentColumn, quantities.minorMomentColumn];
  const momentUnit = unitOf('momentUnit', 'moment', momentColumns) as MomentUnit | undefined;

  const mapping: Partial<ColumnMapping> = {
    memberKeyKind: (member && KEY_KIND_OF_ALIAS[member.name]) ?? 'auto',
    ...(member && { memberColumn: member.header }),
    ...(combination && { combinationColumn: combination.header }),
    ...(envelope && { envelopeColumn: envelope.header }),
    ...(wide && { combinationColumns: wide.map((word) => word.header) }),
    ...(combinationFromSheet && { combinationFromSheet }),
    ...(station && { stationColumn: station.header }),
    ...Object.fromEntries(QUANTITY_ROLES.flatMap((role) => (quantities[role] ? [[role, quantities[role]!.header]] : []))),
    ...(endColumns && { endColumns }),
    ...(forceUnit && { forceUnit }),
    ...(momentUnit && { momentUnit }),
    ...(lengthUnit && { lengthUnit }),
  };
  const missing: MissingField[] = [];
  if (!member) missing.push('memberColumn');
  if (!combination && !envelope && !wide && !combinationFromSheet) missing.push('combinationColumn');
  if (!quantities.shearColumn && !wide) missing.push('shearColumn');
  if (!forceUnit) missing.push('forceUnit');
  if ((station || endColumns) && !lengthUnit) missing.push('lengthUnit');
  if (momentColumns.some(Boolean) && !momentUnit) missing.push('momentUnit');
  return { mapping, missing, unsure };
}
