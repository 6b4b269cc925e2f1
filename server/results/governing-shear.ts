/**
 * Governing shear per member and load combination: the largest |V| over the stations, kept with its sign, station and
 * row so the calculation sheet can say where it came from. Collected from the row stream, so only one value per
 * (member key, combination) is held, never the rows; the result is a columnar table that is stored as it is
 * (governing-file.ts) and read back by check runs.
 */
import type { MemberMatch } from './member-matching';
import type { ResultRow } from './result-row';
import { StringIds } from './string-ids';

export interface GoverningShear {
  combination: string;
  /** Signed as exported; the check uses |shear_N|. */
  shear_N: number;
  station_mm?: number;
  /** Row of the file it came from, and the analysis member key (several keys may feed one IFC member). */
  row: number;
  memberKey: string;
}

/**
 * The governing values of a whole results file, one entry per (member key, combination) in columns. Entries are
 * grouped by key in the order of `memberKeys`, combinations within a key in order of first appearance in the file.
 */
export interface GoverningTable {
  memberKeys: string[];
  combinations: string[];
  /** Index into memberKeys, per entry. */
  key: Uint32Array;
  /** Index into combinations, per entry. */
  combination: Uint32Array;
  shear_N: Float64Array;
  /** NaN where the file has no station column. */
  station_mm: Float64Array;
  row: Uint32Array;
}

/** One member key's governing values, indexed by combination id; holes where the key has no such combination. */
interface KeyColumns {
  shear_N: number[];
  station_mm: number[];
  row: number[];
}

export class GoverningShearCollector {
  // Columns, not an object per (key, combination): a million governing values stay a few arrays per key.
  private readonly byKey = new Map<string, KeyColumns>();
  private readonly combinations = new StringIds();
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
      const current = this.last.shear_N[id];
      if (current === undefined) this.entries++;
      if (isLarger(row.shear_N, current)) {
        this.last.shear_N[id] = row.shear_N;
        this.last.station_mm[id] = row.station_mm ?? Number.NaN;
        this.last.row[id] = row.row;
      }
    }
  };

  /** Everything collected so far, keys in order of first appearance. */
  table(): GoverningTable {
    const table: GoverningTable = {
      memberKeys: [...this.byKey.keys()],
      combinations: [...this.combinations.values],
      key: new Uint32Array(this.entries),
      combination: new Uint32Array(this.entries),
      shear_N: new Float64Array(this.entries),
      station_mm: new Float64Array(this.entries),
      row: new Uint32Array(this.entries),
    };
    let entry = 0;
    let keyIndex = 0;
    for (const columns of this.byKey.values()) {
      columns.shear_N.forEach((shear_N, id) => {
        table.key[entry] = keyIndex;
        table.combination[entry] = id;
        table.shear_N[entry] = shear_N;
        table.station_mm[entry] = columns.station_mm[id];
        table.row[entry] = columns.row[id];
        entry++;
      });
      keyIndex++;
    }
    return table;
  }

  private columnsOf(memberKey: string): KeyColumns {
    let columns = this.byKey.get(memberKey);
    if (!columns) {
      columns = { shear_N: [], station_mm: [], row: [] };
      this.byKey.set(memberKey, columns);
    }
    return columns;
  }
}

/** The governing values of one entry of the table, as the check run reads them. */
export function governingShearAt(table: GoverningTable, entry: number): GoverningShear {
  const station_mm = table.station_mm[entry];
  return {
    combination: table.combinations[table.combination[entry]],
    shear_N: table.shear_N[entry],
    ...(!Number.isNaN(station_mm) && { station_mm }),
    row: table.row[entry],
    memberKey: table.memberKeys[table.key[entry]],
  };
}

/**
 * Governing values per IFC member (by GlobalId) from the matched keys. Where several analysis members feed one IFC
 * member, each combination keeps the largest |V| among them. Only matched keys are turned into objects.
 */
export function governingShearsByMember(table: GoverningTable, matches: readonly MemberMatch[]): Map<string, GoverningShear[]> {
  const ranges = keyRanges(table);
  const byMember = new Map<string, Map<number, number>>();
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
      const current = perCombination.get(combination);
      if (isLarger(table.shear_N[entry], current === undefined ? undefined : table.shear_N[current])) perCombination.set(combination, entry);
    }
  }
  return new Map(
    [...byMember].map(([globalId, perCombination]) => [globalId, [...perCombination.values()].map((entry) => governingShearAt(table, entry))]),
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

/** Equal magnitudes keep the first, so the result does not depend on the sign convention. */
function isLarger(shear_N: number, current_N: number | undefined): boolean {
  return current_N === undefined || Math.abs(shear_N) > Math.abs(current_N);
}
