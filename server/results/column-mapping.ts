/**
 * How the columns of a results file are read: which column holds the member key, the load combination, the station
 * and the shear force along the web, and in which units. A mapping names columns by their header text, so a user can
 * save it once as a template and reuse it for every export of the same analysis program.
 */
import { z } from 'zod';
import { FORCE_UNITS, type ForceUnit, LENGTH_UNITS, type LengthUnit } from '../engine/units';
import { ResultsFileError } from './results-file-error';

export const MEMBER_KEY_KINDS = ['auto', 'globalId', 'tag', 'name'] as const;
export type MemberKeyKind = (typeof MEMBER_KEY_KINDS)[number];

const columnRef = z.string().trim().min(1, 'choose a column').max(200);

export const END_COLUMNS = ['x1', 'y1', 'z1', 'x2', 'y2', 'z2'] as const;
export type EndColumn = (typeof END_COLUMNS)[number];

const endColumnsSchema = z.strictObject({ x1: columnRef, y1: columnRef, z1: columnRef, x2: columnRef, y2: columnRef, z2: columnRef });

export const columnMappingSchema = z
  .strictObject({
    memberColumn: columnRef,
    combinationColumn: columnRef,
    stationColumn: columnRef.optional(),
    /** The shear force along the web (major-axis shear). */
    shearColumn: columnRef,
    /** Analysis member end points, for matching by geometry. */
    endColumns: endColumnsSchema.optional(),
    forceUnit: z.enum(FORCE_UNITS, { error: (issue) => `unknown force unit ${JSON.stringify(issue.input)}; use one of ${FORCE_UNITS.join(', ')}` }),
    /** Unit of the station and end-coordinate columns; required when either is mapped. */
    lengthUnit: z
      .enum(LENGTH_UNITS, { error: (issue) => `unknown length unit ${JSON.stringify(issue.input)}; use one of ${LENGTH_UNITS.join(', ')}` })
      .optional(),
    /** What the member key column holds, if known; 'auto' tries GlobalId, then Tag, then Name. */
    memberKeyKind: z.enum(MEMBER_KEY_KINDS).default('auto'),
  })
  .superRefine((mapping, ctx) => {
    if ((mapping.stationColumn || mapping.endColumns) && !mapping.lengthUnit) {
      ctx.addIssue({ code: 'custom', path: ['lengthUnit'], message: 'choose the length unit of the station and coordinate columns' });
    }
    const used = new Map<string, string>();
    for (const [role, column] of mappedColumns(mapping)) {
      const other = used.get(normalizeHeader(column));
      if (other) ctx.addIssue({ code: 'custom', path: [role], message: `column '${column}' is already used for ${other}` });
      else used.set(normalizeHeader(column), role);
    }
  });

export type ColumnMapping = z.output<typeof columnMappingSchema>;

function mappedColumns(mapping: Omit<ColumnMapping, 'memberKeyKind'>): Array<[string, string]> {
  const roles: Array<[string, string | undefined]> = [
    ['memberColumn', mapping.memberColumn],
    ['combinationColumn', mapping.combinationColumn],
    ['stationColumn', mapping.stationColumn],
    ['shearColumn', mapping.shearColumn],
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
  combination: number;
  station?: number;
  shear: number;
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
  return {
    member: index(mapping.memberColumn),
    combination: index(mapping.combinationColumn),
    station: mapping.stationColumn === undefined ? undefined : index(mapping.stationColumn),
    shear: index(mapping.shearColumn),
    ends: mapping.endColumns && END_COLUMNS.map((end) => index(mapping.endColumns![end])),
  };
}

// --- Guessing a mapping from the header ---------------------------------------------------------------------------

type GuessedRole = 'memberColumn' | 'combinationColumn' | 'stationColumn' | 'shearColumn';

/** Header names (normalized, units removed) per role, most specific first. */
const ALIASES: Record<GuessedRole, readonly string[]> = {
  memberColumn: ['member', 'member key', 'member id', 'globalid', 'global id', 'ifc globalid', 'guid', 'ifc guid', 'tag', 'mark', 'piece mark', 'member name', 'name', 'element', 'element id', 'beam', 'bar', 'id', 'label'],
  combinationColumn: ['combination', 'load combination', 'combo', 'load combo', 'comb', 'lc', 'load case', 'loadcase', 'case'],
  stationColumn: ['station', 'position', 'distance', 'location', 'pos'],
  // EN 1993 member axes put z along the web, so Vz is the shear the web carries.
  shearColumn: ['shear', 'shear force', 'ved', 'v ed', 'v', 'vz', 'vz ed'],
};

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

const FORCE_UNIT_WORDS: Readonly<Record<string, ForceUnit>> = { n: 'N', kn: 'kN', kip: 'kip', kips: 'kip', lbf: 'lbf', lb: 'lbf' };
const LENGTH_UNIT_WORDS: Readonly<Record<string, LengthUnit>> = { mm: 'mm', m: 'm', in: 'in', inch: 'in', ft: 'ft', feet: 'ft' };

/** A unit at the end of a header: 'V [kN]', 'shear (kip)', 'station_m', 'x1 mm'. */
const BRACKETED_UNIT = /[[(]\s*([a-z]+)\s*[\])]\s*$/i;
const TRAILING_UNIT = /[\s_]([a-z]+)$/i;

export interface MappingGuess {
  /** What could be read from the header; the user completes the rest. */
  mapping: Partial<ColumnMapping>;
  /** Required fields the header did not reveal. */
  missing: Array<'memberColumn' | 'combinationColumn' | 'shearColumn' | 'forceUnit' | 'lengthUnit'>;
}

interface HeaderWords {
  header: string;
  name: string;
  unit?: string;
}

function headerWords(header: string): HeaderWords {
  const text = header.trim();
  const bracketed = BRACKETED_UNIT.exec(text);
  if (bracketed) return { header, name: aliasForm(text.slice(0, bracketed.index)), unit: bracketed[1].toLowerCase() };
  const trailing = TRAILING_UNIT.exec(text);
  const word = trailing?.[1].toLowerCase();
  if (word && (word in FORCE_UNIT_WORDS || word in LENGTH_UNIT_WORDS)) {
    return { header, name: aliasForm(text.slice(0, trailing!.index)), unit: word };
  }
  return { header, name: aliasForm(text) };
}

function aliasForm(text: string): string {
  return text.toLowerCase().replace(/[^a-z0-9]+/g, ' ').trim();
}

/**
 * A mapping guessed from header names: the default format (`member,combination,shear`, optional `station`) and the
 * usual names analysis exports give these columns, with units read from brackets or suffixes ('V [kN]').
 */
export function guessMapping(headers: readonly string[]): MappingGuess {
  const words = headers.map(headerWords);
  const taken = new Set<number>();
  const pick = (aliases: readonly string[]): HeaderWords | undefined => {
    for (const alias of aliases) {
      const index = words.findIndex((word, i) => !taken.has(i) && word.name === alias);
      if (index >= 0) {
        taken.add(index);
        return words[index];
      }
    }
    return undefined;
  };
  const member = pick(ALIASES.memberColumn);
  const combination = pick(ALIASES.combinationColumn);
  const station = pick(ALIASES.stationColumn);
  const shear = pick(ALIASES.shearColumn);
  const ends = END_COLUMNS.map((end) => pick(END_ALIASES[end]));
  const endColumns = ends.every((end) => end !== undefined)
    ? (Object.fromEntries(END_COLUMNS.map((end, i) => [end, ends[i]!.header])) as Record<EndColumn, string>)
    : undefined;

  const forceUnit = shear?.unit === undefined ? undefined : FORCE_UNIT_WORDS[shear.unit];
  const lengthUnit = [station, ...(endColumns ? ends : [])]
    .map((column) => (column?.unit === undefined ? undefined : LENGTH_UNIT_WORDS[column.unit]))
    .find((unit) => unit !== undefined);

  const mapping: Partial<ColumnMapping> = {
    memberKeyKind: (member && KEY_KIND_OF_ALIAS[member.name]) ?? 'auto',
    ...(member && { memberColumn: member.header }),
    ...(combination && { combinationColumn: combination.header }),
    ...(station && { stationColumn: station.header }),
    ...(shear && { shearColumn: shear.header }),
    ...(endColumns && { endColumns }),
    ...(forceUnit && { forceUnit }),
    ...(lengthUnit && { lengthUnit }),
  };
  const missing: MappingGuess['missing'] = [];
  if (!member) missing.push('memberColumn');
  if (!combination) missing.push('combinationColumn');
  if (!shear) missing.push('shearColumn');
  if (!forceUnit) missing.push('forceUnit');
  if ((station || endColumns) && !lengthUnit) missing.push('lengthUnit');
  return { mapping, missing };
}
