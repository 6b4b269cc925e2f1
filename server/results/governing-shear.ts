/**
 * Governing forces per member and load combination, collected from the row stream so only one set of values per
 * (member key, combination) is held, never the rows; the result is a columnar table that is stored as it is
 * (governing-file.ts) and read back by check runs. Four sets per entry:
 * - the largest |Vz| (shear along the web), signed, with its station, row and the My at that station;
 * - the largest |Vy| with its station, row and the Mz at that station;
 * - the largest |My| and the largest |Mz|, each with its station.
 * Missing values are NaN, so a member without an axis is 'not given', not zero. Only the largest |V| per
 * combination is kept, not the force at every station (a tapered member is checked with its smallest section).
 */
import type { MemberMatch } from './member-matching';
import type { ResultRow } from './result-row';
import { StringIds } from './string-ids';

/** The largest |Vy| of a combination and where it came from. */
export interface MinorShear {
  shear_N: number;
  station_mm?: number;
  /** Mz at the same station, when given there. */
  moment_Nmm?: number;
  row: number;
  memberKey: string;
  sheet?: string;
}

/** The largest |M| about one axis over the stations of a combination. */
export interface MomentPeak {
  moment_Nmm: number;
  station_mm?: number;
}

export interface GoverningShear {
  combination: string;
  /** Vz, signed as exported; the check uses |shear_N|. */
  shear_N: number;
  station_mm?: number;
  /** Row of the file it came from, and the analysis member key (several keys may feed one IFC member). */
  row: number;
  memberKey: string;
  /** The worksheet of `row`, when several were read. */
  sheet?: string;
  /** My at the station of shear_N, when given there. */
  majorMoment_Nmm?: number;
  /** Present when the file gives Vy for this member and combination. */
  minor?: MinorShear;
  majorMomentPeak?: MomentPeak;
  minorMomentPeak?: MomentPeak;
}

export const GOVERNING_FLOAT_COLUMNS = [
  'shear_N',
  'station_mm',
  'majorMoment_Nmm',
  'minorShear_N',
  'minorStation_mm',
  'minorMoment_Nmm',
  'majorMomentPeak_Nmm',
  'majorMomentPeakStation_mm',
  'minorMomentPeak_Nmm',
  'minorMomentPeakStation_mm',
] as const;
export const GOVERNING_INDEX_COLUMNS = ['key', 'combination', 'row', 'sheet', 'minorRow', 'minorSheet'] as const;
export type GoverningFloatColumn = (typeof GOVERNING_FLOAT_COLUMNS)[number];
export type GoverningIndexColumn = (typeof GOVERNING_INDEX_COLUMNS)[number];
export type GoverningColumn = GoverningFloatColumn | GoverningIndexColumn;

/** Columns every table has; the others only when the file gave such values. */
export const REQUIRED_GOVERNING_COLUMNS = ['shear_N', 'station_mm', 'key', 'combination', 'row'] as const;
type RequiredColumn = (typeof REQUIRED_GOVERNING_COLUMNS)[number];

/**
 * The governing values of a whole results file, one entry per (member key, combination) in columns. Entries are
 * grouped by key in the order of `memberKeys`, combinations within a key in order of first appearance in the file.
 * Float columns hold NaN where not given (station_mm where the file has no station column); `minorRow` is 0 where
 * the entry has no Vy.
 */
export type GoverningTable = {
  memberKeys: string[];
  combinations: string[];
  /** The worksheets `sheet` and `minorSheet` index, when several were read. */
  sheets?: string[];
} & { [C in RequiredColumn]: C extends GoverningFloatColumn ? Float64Array : Uint32Array } & {
  [C in Exclude<GoverningFloatColumn, RequiredColumn>]?: Float64Array;
} & { [C in Exclude<GoverningIndexColumn, RequiredColumn>]?: Uint32Array };

/** One member key's values by column, each indexed by combination id; holes where not given. */
type KeyColumns = { [C in Exclude<GoverningColumn, 'key' | 'combination'>]?: number[] } & { shear_N: number[] };

export class GoverningShearCollector {
  // Columns, not an object per (key, combination): a million governing values stay a few arrays per key.
  private readonly byKey = new Map<string, KeyColumns>();
  private readonly combinations = new StringIds();
  /** Optional columns some row has given. */
  private readonly given = new Set<GoverningColumn>();
  private entries = 0;
  /** Rows of one member usually come together: its columns are kept at hand. */
  private lastKey: string | undefined;
  private last: KeyColumns | undefined;

  /** A results sink: pass it to readResults (bound, so `collector.add` can be handed over as is). */
  readonly add = (batch: readonly ResultRow[]): void => {
    for (const row of batch) {
      if (row.memberKey !== this.lastKey || !this.last) {
        this.lastKey = row.memberKey;
        this.last = this.columnsOf(row.memberKey);
      }
      const id = this.combinations.idOf(row.combination);
      const columns = this.last;
      if (columns.shear_N[id] === undefined) this.entries++;
      if (isLarger(row.shear_N, columns.shear_N[id])) {
        columns.shear_N[id] = row.shear_N;
        this.set(columns, 'station_mm', id, row.station_mm);
        this.set(columns, 'row', id, row.row);
        this.set(columns, 'sheet', id, row.sheet);
        this.set(columns, 'majorMoment_Nmm', id, row.majorMoment_Nmm);
      }
      if (row.minorShear_N !== undefined && isLarger(row.minorShear_N, columns.minorShear_N?.[id])) {
        this.set(columns, 'minorShear_N', id, row.minorShear_N);
        this.set(columns, 'minorStation_mm', id, row.station_mm);
        this.set(columns, 'minorRow', id, row.row);
        this.set(columns, 'minorSheet', id, row.sheet);
        this.set(columns, 'minorMoment_Nmm', id, row.minorMoment_Nmm);
      }
      if (row.majorMoment_Nmm !== undefined && isLarger(row.majorMoment_Nmm, columns.majorMomentPeak_Nmm?.[id])) {
        this.set(columns, 'majorMomentPeak_Nmm', id, row.majorMoment_Nmm);
        this.set(columns, 'majorMomentPeakStation_mm', id, row.station_mm);
      }
      if (row.minorMoment_Nmm !== undefined && isLarger(row.minorMoment_Nmm, columns.minorMomentPeak_Nmm?.[id])) {
        this.set(columns, 'minorMomentPeak_Nmm', id, row.minorMoment_Nmm);
        this.set(columns, 'minorMomentPeakStation_mm', id, row.station_mm);
      }
    }
  };

  /** Everything collected so far, keys in order of first appearance; `sheets` names the sheet indexes of the rows. */
  table(sheets?: readonly string[]): GoverningTable {
    const count = this.entries;
    const table: GoverningTable = {
      memberKeys: [...this.byKey.keys()],
      combinations: [...this.combinations.values],
      ...(this.given.has('sheet') && sheets && { sheets: [...sheets] }),
      key: new Uint32Array(count),
      combination: new Uint32Array(count),
      shear_N: new Float64Array(count),
      station_mm: new Float64Array(count),
      row: new Uint32Array(count),
    };
    const columns = [...REQUIRED_GOVERNING_COLUMNS, ...this.given].filter((column) => column !== 'key' && column !== 'combination') as Array<
      Exclude<GoverningColumn, 'key' | 'combination'>
    >;
    for (const column of columns) {
      if (table[column] === undefined) (table as Record<string, unknown>)[column] = isFloatColumn(column) ? new Float64Array(count) : new Uint32Array(count);
    }
    let entry = 0;
    let keyIndex = 0;
    for (const values of this.byKey.values()) {
      values.shear_N.forEach((_, id) => {
        table.key[entry] = keyIndex;
        table.combination[entry] = id;
        for (const column of columns) table[column]![entry] = values[column]?.[id] ?? (isFloatColumn(column) ? Number.NaN : 0);
        entry++;
      });
      keyIndex++;
    }
    return table;
  }

  /** Sets a value, NaN for none (so a larger force without a moment does not keep the moment of a smaller one). */
  private set(columns: KeyColumns, column: Exclude<GoverningColumn, 'key' | 'combination' | 'shear_N'>, id: number, value: number | undefined): void {
    if (value === undefined) {
      const values = columns[column];
      if (values) values[id] = Number.NaN;
      return;
    }
    this.given.add(column);
    (columns[column] ??= [])[id] = value;
  }

  private columnsOf(memberKey: string): KeyColumns {
    let columns = this.byKey.get(memberKey);
    if (!columns) {
      columns = { shear_N: [] };
      this.byKey.set(memberKey, columns);
    }
    return columns;
  }
}

export function isFloatColumn(column: GoverningColumn): column is GoverningFloatColumn {
  return (GOVERNING_FLOAT_COLUMNS as readonly string[]).includes(column);
}

/** The governing values of one entry of the table, as the check run reads them. */
export function governingShearAt(table: GoverningTable, entry: number): GoverningShear {
  return governingShearOf(table, entry, entry, entry, entry);
}

/** One combination's values from the entries that hold its largest |Vz|, |Vy|, |My| and |Mz| (-1: none). */
function governingShearOf(table: GoverningTable, major: number, minor: number, majorPeak: number, minorPeak: number): GoverningShear {
  const given = (column: GoverningFloatColumn, entry: number): number | undefined => {
    const value = entry < 0 ? undefined : table[column]?.[entry];
    return value === undefined || Number.isNaN(value) ? undefined : value;
  };
  const sheetOf = (column: 'sheet' | 'minorSheet', entry: number): string | undefined => {
    const index = table[column]?.[entry];
    return index === undefined ? undefined : table.sheets?.[index];
  };
  const station_mm = given('station_mm', major);
  const sheet = sheetOf('sheet', major);
  const majorMoment_Nmm = given('majorMoment_Nmm', major);
  const shear: GoverningShear = {
    combination: table.combinations[table.combination[major]],
    shear_N: table.shear_N[major],
    ...(station_mm !== undefined && { station_mm }),
    row: table.row[major],
    memberKey: table.memberKeys[table.key[major]],
    ...(sheet !== undefined && { sheet }),
    ...(majorMoment_Nmm !== undefined && { majorMoment_Nmm }),
  };
  const minorShear_N = given('minorShear_N', minor);
  if (minorShear_N !== undefined) {
    const minorStation = given('minorStation_mm', minor);
    const minorMoment = given('minorMoment_Nmm', minor);
    const minorSheet = sheetOf('minorSheet', minor);
    shear.minor = {
      shear_N: minorShear_N,
      ...(minorStation !== undefined && { station_mm: minorStation }),
      ...(minorMoment !== undefined && { moment_Nmm: minorMoment }),
      row: table.minorRow![minor],
      memberKey: table.memberKeys[table.key[minor]],
      ...(minorSheet !== undefined && { sheet: minorSheet }),
    };
  }
  const peak = (moment: GoverningFloatColumn, station: GoverningFloatColumn, entry: number): MomentPeak | undefined => {
    const moment_Nmm = given(moment, entry);
    if (moment_Nmm === undefined) return undefined;
    const station_mm = given(station, entry);
    return { moment_Nmm, ...(station_mm !== undefined && { station_mm }) };
  };
  const majorMomentPeak = peak('majorMomentPeak_Nmm', 'majorMomentPeakStation_mm', majorPeak);
  const minorMomentPeak = peak('minorMomentPeak_Nmm', 'minorMomentPeakStation_mm', minorPeak);
  if (majorMomentPeak) shear.majorMomentPeak = majorMomentPeak;
  if (minorMomentPeak) shear.minorMomentPeak = minorMomentPeak;
  return shear;
}

/** The column each set is governed by, in the order governingShearOf takes their entries. */
const SET_COLUMNS = ['shear_N', 'minorShear_N', 'majorMomentPeak_Nmm', 'minorMomentPeak_Nmm'] as const;

/**
 * Governing values per IFC member (by GlobalId) from the matched keys. Where several analysis members feed one IFC
 * member, each combination keeps, set by set, the largest value among them. Only matched keys become objects.
 */
export function governingShearsByMember(table: GoverningTable, matches: readonly MemberMatch[]): Map<string, GoverningShear[]> {
  const ranges = keyRanges(table);
  const byMember = new Map<string, Map<number, number[]>>();
  const sets = SET_COLUMNS.map((column) => table[column]);
  for (const match of matches) {
    const range = ranges.get(match.memberKey);
    if (!range) continue;
    let perCombination = byMember.get(match.globalId);
    if (!perCombination) {
      perCombination = new Map();
      byMember.set(match.globalId, perCombination);
    }
    for (let entry = range[0]; entry < range[1]; entry++) {
      const combination = table.combination[entry];
      let chosen = perCombination.get(combination);
      if (!chosen) {
        chosen = [-1, -1, -1, -1];
        perCombination.set(combination, chosen);
      }
      sets.forEach((values, set) => {
        if (values && isLarger(values[entry], chosen[set] < 0 ? undefined : values[chosen[set]])) chosen[set] = entry;
      });
    }
  }
  return new Map(
    [...byMember].map(([globalId, perCombination]) => [
      globalId,
      [...perCombination.values()].map(([major, minor, majorPeak, minorPeak]) => governingShearOf(table, major, minor, majorPeak, minorPeak)),
    ]),
  );
}

/** [first, end) entries of each member key; entries are grouped by key. */
function keyRanges(table: GoverningTable): Map<string, [number, number]> {
  const ranges = new Map<string, [number, number]>();
  const count = table.key.length;
  let start = 0;
  for (let entry = 1; entry <= count; entry++) {
    if (entry === count || table.key[entry] !== table.key[start]) {
      ranges.set(table.memberKeys[table.key[start]], [start, entry]);
      start = entry;
    }
  }
  return ranges;
}

/** A given value beats none; equal magnitudes keep the first, so the result does not depend on the sign convention. */
function isLarger(value: number, current: number | undefined): boolean {
  if (Number.isNaN(value)) return false;
  return current === undefined || Number.isNaN(current) || Math.abs(value) > Math.abs(current);
}
