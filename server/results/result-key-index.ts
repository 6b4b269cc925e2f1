/**
 * What the reader remembers while a results file streams past: each distinct member key (with its end points and row
 * count) and, per member and combination, the rows already seen, to catch repeated rows. Keys are interned to small
 * integers and the per-pair record is a first row number, so a million rows cost a few megabytes, not the rows.
 */
import type { Point3_mm } from '../ifc/model-read-result';
import type { RowIssue } from './results-file-error';
import type { ResultRow } from './result-row';
import { StringIds } from './string-ids';

export interface ResultKeySummary {
  memberKey: string;
  rows: number;
  firstRow: number;
  end1_mm?: Point3_mm;
  end2_mm?: Point3_mm;
}

/** Coordinates of one analysis member given on several rows may differ by rounding only. */
const END_POINT_TOLERANCE_MM = 0.001;

type SeenRows = number | Map<number, number>;

export class ResultKeyIndex {
  private readonly memberIds = new Map<string, number>();
  private readonly keys: ResultKeySummary[] = [];
  private readonly combinationIds = new StringIds();
  /** seen[member][combination]: the first row, or with a station column the first row per station (NaN = blank). */
  private readonly seen: SeenRows[][] = [];
  /** Rows of one member usually come together: its id is kept at hand. */
  private lastKey: string | undefined;
  private lastId = -1;

  constructor(private readonly hasStations: boolean) {}

  /** Records a valid row; returns the problem when it repeats an earlier row or moves the member's end points. */
  register(row: ResultRow): RowIssue | undefined {
    const memberId = this.memberId(row);
    const combinationId = this.combinationIds.idOf(row.combination);
    const key = this.keys[memberId];
    const repeated = this.repeatedRow(memberId, combinationId, row);
    if (repeated !== undefined) {
      const at = row.station_mm === undefined ? '' : ` at station ${row.station_mm} mm`;
      return {
        row: row.row,
        code: 'duplicate_row',
        message: `Row ${row.row} repeats member '${row.memberKey}', combination '${row.combination}'${at} of row ${repeated}.`,
      };
    }
    if (row.end1_mm && key.end1_mm && key.end2_mm && !(samePoint(row.end1_mm, key.end1_mm) && samePoint(row.end2_mm!, key.end2_mm))) {
      return {
        row: row.row,
        code: 'coordinates_inconsistent',
        message: `Row ${row.row} gives member '${row.memberKey}' other end points than row ${key.firstRow}.`,
      };
    }
    key.rows++;
    if (row.end1_mm && !key.end1_mm) {
      key.end1_mm = row.end1_mm;
      key.end2_mm = row.end2_mm;
    }
    return undefined;
  }

  memberKeys(): ResultKeySummary[] {
    return this.keys;
  }

  combinations(): string[] {
    return [...this.combinationIds.values];
  }

  private memberId(row: ResultRow): number {
    if (row.memberKey === this.lastKey) return this.lastId;
    let id = this.memberIds.get(row.memberKey);
    if (id === undefined) {
      id = this.keys.length;
      this.memberIds.set(row.memberKey, id);
      this.keys.push({ memberKey: row.memberKey, rows: 0, firstRow: row.row });
      this.seen.push([]);
    }
    this.lastKey = row.memberKey;
    this.lastId = id;
    return id;
  }

  /** The earlier row with the same member, combination (and station), registering this one if there is none. */
  private repeatedRow(memberId: number, combinationId: number, row: ResultRow): number | undefined {
    const perCombination = this.seen[memberId];
    const seen = perCombination[combinationId];
    if (!this.hasStations) {
      if (seen !== undefined) return seen as number;
      perCombination[combinationId] = row.row;
      return undefined;
    }
    const station = row.station_mm ?? Number.NaN;
    const stations = (seen as Map<number, number> | undefined) ?? new Map<number, number>();
    const earlier = stations.get(station);
    if (earlier !== undefined) return earlier;
    stations.set(station, row.row);
    perCombination[combinationId] = stations;
    return undefined;
  }
}

function samePoint(a: Point3_mm, b: Point3_mm): boolean {
  return (
    Math.abs(a[0] - b[0]) <= END_POINT_TOLERANCE_MM &&
    Math.abs(a[1] - b[1]) <= END_POINT_TOLERANCE_MM &&
    Math.abs(a[2] - b[2]) <= END_POINT_TOLERANCE_MM
  );
}
