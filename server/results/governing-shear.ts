/**
 * Governing shear per member and load combination: the largest |V| over the stations, kept with its sign, station and
 * row so the calculation sheet can say where it came from. Collected from the row stream, so only one value per
 * (member key, combination) is held, never the rows.
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

type PerCombination = Map<string, GoverningShear>;

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
      if (isLarger(row.shear_N, this.last.shear_N[id])) {
        this.last.shear_N[id] = row.shear_N;
        this.last.station_mm[id] = row.station_mm ?? Number.NaN;
        this.last.row[id] = row.row;
      }
    }
  };

  /** Governing values per member key, combinations in order of first appearance in the file. */
  perKey(): Map<string, GoverningShear[]> {
    const perKey = new Map<string, GoverningShear[]>();
    for (const [memberKey, columns] of this.byKey) {
      const shears: GoverningShear[] = [];
      columns.shear_N.forEach((shear_N, id) => {
        const station_mm = columns.station_mm[id];
        shears.push({
          combination: this.combinations.values[id],
          shear_N,
          station_mm: Number.isNaN(station_mm) ? undefined : station_mm,
          row: columns.row[id],
          memberKey,
        });
      });
      perKey.set(memberKey, shears);
    }
    return perKey;
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

/**
 * Governing values per IFC member (by GlobalId) from the matched keys. Where several analysis members feed one IFC
 * member, each combination keeps the largest |V| among them.
 */
export function governingShearsByMember(
  perKey: ReadonlyMap<string, readonly GoverningShear[]>,
  matches: readonly MemberMatch[],
): Map<string, GoverningShear[]> {
  const byMember = new Map<string, PerCombination>();
  for (const match of matches) {
    let perCombination = byMember.get(match.globalId);
    if (!perCombination) {
      perCombination = new Map();
      byMember.set(match.globalId, perCombination);
    }
    for (const shear of perKey.get(match.memberKey) ?? []) {
      if (isLarger(shear.shear_N, perCombination.get(shear.combination)?.shear_N)) perCombination.set(shear.combination, shear);
    }
  }
  return new Map([...byMember].map(([globalId, perCombination]) => [globalId, [...perCombination.values()]]));
}

/** Equal magnitudes keep the first, so the result does not depend on the sign convention. */
function isLarger(shear_N: number, current_N: number | undefined): boolean {
  return current_N === undefined || Math.abs(shear_N) > Math.abs(current_N);
}
