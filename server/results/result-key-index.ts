/**
 * What the reader remembers while a results file streams past: each distinct member key (with its end points and row
 * count) and, per member and combination, the rows already seen, to catch repeated rows. Keys are interned to small
 * integers and the per-pair record is a first row number, so a million rows cost a few megabytes, not the rows.
 * When several sheets are read, a row is remembered with its sheet (sheet × 2^32 + row: exact in a double).
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
const ROWS_PER_SHEET = 2 ** 32;

type SeenRows = number | Map<number, number>;

export class ResultKeyIndex {
  private readonly memberIds = new Map<string, number>();
  private readonly keys: ResultKeySummary[] = [];
  private readonly combinationIds = new StringIds();
  /** seen[member][combination]: the first row, or with a station column the first row per station (NaN = blank). */
  private readonly seen: SeenRows[][] = [];
  /** Where each member key was first seen (sheet × 2^32 + row). */
  private readonly firstLocations: number[] = [];
  /** Rows of one member usually come together: its id is kept at hand. */
  private lastKey: string | undefined;
  private lastId = -1;

  /** The sheet being read, an index into `sheetNames`. */
  sheet = 0;

  /** `sheetNames` when several sheets are read: messages then name the sheet of each row. */
  constructor(
    private readonly hasStations: boolean,
    private readonly sheetNames?: readonly string[],
  ) {}

  /** Records a valid row; returns the problem when it repeats an earlier row or moves the member's end points. */
  register(row: ResultRow): RowIssue | undefined {
    const memberId = this.memberId(row);
    const combinationId = this.combinationIds.idOf(row.combination);
    const key = this.keys[memberId];
    const location = this.sheet * ROWS_PER_SHEET + row.row;
    const repeated = this.repeatedRow(memberId, combinationId, row.station_mm, location);
    if (repeated !== undefined) {
      const at = row.station_mm === undefined ? '' : ` at station ${row.station_mm} mm`;
      return this.issue(row.row, 'duplicate_row', `repeats member '${row.memberKey}', combination '${row.combination}'${at} of ${this.where(repeated, false)}`);
    }
    if (row.end1_mm && key.end1_mm && key.end2_mm && !(samePoint(row.end1_mm, key.end1_mm) && samePoint(row.end2_mm!, key.end2_mm))) {
      return this.issue(row.row, 'coordinates_inconsistent', `gives member '${row.memberKey}' other end points than ${this.where(this.firstLocations[memberId], false)}`);
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
      this.firstLocations.push(this.sheet * ROWS_PER_SHEET + row.row);
      this.seen.push([]);
    }
    this.lastKey = row.memberKey;
    this.lastId = id;
    return id;
  }

  /** 'Row 7', or 'Sheet 'B', row 7' when several sheets are read; `location` is sheet × 2^32 + row. */
  private where(location: number, capital: boolean): string {
    const row = location % ROWS_PER_SHEET;
    if (!this.sheetNames) return `${capital ? 'Row' : 'row'} ${row}`;
    return `${capital ? 'Sheet' : 'sheet'} '${this.sheetNames[Math.floor(location / ROWS_PER_SHEET)]}', row ${row}`;
  }

  private issue(row: number, code: RowIssue['code'], what: string): RowIssue {
    const sheet = this.sheetNames?.[this.sheet];
    return { row, ...(sheet !== undefined && { sheet }), code, message: `${this.where(this.sheet * ROWS_PER_SHEET + row, true)} ${what}.` };
  }

  /** The earlier row with the same member, combination (and station), registering this one if there is none. */
  private repeatedRow(memberId: number, combinationId: number, station_mm: number | undefined, location: number): number | undefined {
    const perCombination = this.seen[memberId];
    const seen = perCombination[combinationId];
    if (!this.hasStations) {
      if (seen !== undefined) return seen as number;
      perCombination[combinationId] = location;
      return undefined;
    }
    const station = station_mm ?? Number.NaN;
    const stations = (seen as Map<number, number> | undefined) ?? new Map<number, number>();
    const earlier = stations.get(station);
    if (earlier !== undefined) return earlier;
    stations.set(station, location);
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
